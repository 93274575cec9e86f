/**
 * The demo design: an invented scenario (no real make or model). A 3.5 t long-wheelbase panel van,
 * converted from diesel to battery-electric drive and fitted out as a camper; the traction battery
 * sits in the floor between the axles, which lowers the CG, and the rear axle carries the motor.
 *
 * The demo fails on purpose: the regenerative torque as set in the motor controller (90 N·m) makes the rear
 * axle lock first at the lower speeds, unladen and laden (the demo is a light N1 van, judged by the M1 lock-order
 * rule). Every other check passes, and the verdict names the largest regenerative force that keeps them passing
 * per load state — the finding a
 * battery-electric conversion most needs to see (issue 12 point 4).
 */
import type { DesignFile } from './design.ts';

export function demoDesign(): DesignFile {
  return {
    format: 'lockstep-design/1',
    name: 'Demo: long-wheelbase panel van, battery-electric camper conversion',
    notes:
      'Invented example. Diesel engine, gearbox and fuel tank removed; 74 kWh floor battery between the axles, ' +
      'rear drive unit, camper furniture, 80 l fresh-water tank over the rear axle.',
    vehicle: { category: 'N1', wheelbase_m: 3.665, abs: false, drive: 'rear' },
    load_states: [
      { id: 'unladen', label: 'Unladen, driver only', kind: 'unladen', mass_kg: 2720, front_axle_kg: 1420, cg_height_m: 0.78 },
      { id: 'laden', label: 'Laden to 3500 kg', kind: 'laden', mass_kg: 3500, front_axle_kg: 1610, cg_height_m: 0.9 },
    ],
    axles: {
      front: {
        tyre_radius_m: 0.345,
        brake: {
          type: 'disc',
          caliper: 'sliding',
          piston_diameters_mm: [48, 48],
          effective_radius_m: 0.128,
          pad_friction: 0.4,
          threshold_pressure_bar: 0.5,
        },
      },
      rear: {
        tyre_radius_m: 0.345,
        brake: {
          type: 'disc',
          caliper: 'sliding',
          piston_diameters_mm: [48],
          effective_radius_m: 0.118,
          pad_friction: 0.4,
          threshold_pressure_bar: 1,
        },
      },
    },
    hydraulics: {
      master_cylinder_bore_mm: 25.4,
      pedal_ratio: 3.8,
      booster_ratio: 5.5,
      booster_runout_bar: 90,
      circuit_split: 'front_rear',
      rear_valve: {
        type: 'load_sensing',
        ratio: 0.5,
        knee_bar_at_rear_axle_kg: [
          [1200, 20],
          [1900, 48],
        ],
      },
    },
    adhesion_coefficients: [0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0],
    // Hand lever and cables to drum-in-hat shoes in the rear discs (invented figures).
    parking_brake: { axle: 'rear', control: 'hand', lever_ratio: 45, efficiency: 0.7, brake_factor: 2.2, effective_radius_m: 0.09 },
    // Rear drive unit: regenerative torque as set in the motor controller (invented figures).
    regen: { max_motor_torque_nm: 90, gear_ratio: 9.5, max_power_kw: 40, blending: { type: 'regen_first' } },
    // Rotor masses as weighed; base vehicle = the diesel van laden as it left the factory (invented figures).
    heat: { front_rotor_kg: 9.5, rear_rotor_kg: 7, max_speed_kmh: 130, base_vehicle_mass_kg: 3100, base_vehicle_front_axle_kg: 1560 },
    provenance: {
      'load_states[0].front_axle_kg': { source: 'measured', value: 1420, note: 'weighbridge, driver on board' },
      'load_states[1].cg_height_m': { source: 'assumed', value: 0.9, note: 'estimated from the fit-out' },
      'axles.rear.brake.pad_friction': { source: 'maker', value: 0.4, note: 'pad data sheet, mean value' },
    },
  };
}
