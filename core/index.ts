/**
 * The engine's public surface. Everything here is pure: no I/O, SI units inside.
 * "No answer" is reported as data (null with a warning), never by throwing; CoreError is thrown only
 * for programming errors such as an unknown command option reaching the core.
 */
export * from './constants.ts';
export * from './units.ts';
export * from './design.ts';
export * from './validate.ts';
export * from './axle-loads.ts';
export * from './ideal-distribution.ts';
export * from './brake-gain.ts';
export * from './rear-valve.ts';
export * from './distribution.ts';
export * from './installed-distribution.ts';
export * from './adhesion-utilisation.ts';
export * from './lock-order.ts';
export * from './crossings.ts';
export * from './pedal-force.ts';
export * from './state-model.ts';
export * from './operating-point.ts';
export * from './curves.ts';
export * from './evaluate.ts';
export * from './demo.ts';
export * from './caution.ts';
export * from './version.ts';
