/**
 * The engine's public surface. Everything here is pure: no I/O, SI units inside.
 * "No answer" is reported as data (null with a warning), never by throwing; CoreError is thrown only
 * for programming errors such as an unknown command option reaching the core.
 */
export * from './constants.ts';
export * from './units.ts';
export * from './design.ts';
export { inputSource, recordSource, type InputSource, type ProvenanceEntry, type ProvenanceSource, type ProvenanceState } from './provenance.ts';
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
export * from './hardware-schema.ts';
export * from './category-figures.ts';
export * from './fluid-volume.ts';
export * from './valve-failure.ts';
export * from './pitfalls.ts';
export * from './demo.ts';
export * from './caution.ts';
export * from './version.ts';
export * from './canonical-json.ts';
export * from './design-diff.ts';
export * from './axle-lift.ts';
export * from './axle-lift-file.ts';
export * from './traction.ts';
export * from './lock-order-range.ts';
export * from './regen.ts';
export * from './stopping.ts';
export * from './brake-heat.ts';
export * from './roller-tester.ts';
export * from './limits.ts';
export * from './bounded-number.ts';
export * from './occupant-masses.ts';
export * from './build-up-schema.ts';
export * from './build-up.ts';
export * from './ratings.ts';
export * from './rules/index.ts';
export * from './checks/check-result.ts';
export * from './checks/curve-check.ts';
export * from './checks/circuit-failure.ts';
export * from './checks/performance-check.ts';
export * from './checks/run-checks.ts';
export * from './checks/limit-series.ts';
export * from './checks/polynomial.ts';
export * from './sizing/index.ts';
export * from './verdict.ts';
