// Sources (inspection practice): 1.1 (NSW Brake assessment manual Table 1: tyre
// diameter change above ±7 %, booster removed, diagonal split converted to front/rear; ESC disabled
// blocks a certificate), 1.3 (IVA: bias adjuster within the driver's reach fails), section 2
// (load-sensing valves on modified suspension; drum master cylinders with calipers; EV conversions need a
// vacuum pump; ABS/ESP expected to keep working) and 4 item 12 (pitfalls a tool must warn about).
// The demo (core/demo.ts) states none of these facts and must stay quiet.
import { describe, expect, it } from 'vitest';
import { demoDesign, type DesignFile, evaluate, pitfalls, readDesign } from '../../core/index.ts';

function withBlocks(patch: (d: DesignFile) => void): DesignFile {
  const d = structuredClone(demoDesign());
  patch(d);
  const r = readDesign(d);
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}
const codes = (d: DesignFile) => pitfalls(d).map((p) => p.code);

describe('quiet designs', () => {
  it('the demo raises no pitfall', () => {
    expect(pitfalls(demoDesign())).toEqual([]);
    expect(evaluate(demoDesign()).pitfalls).toEqual([]);
  });
  it('a demo with honest base-vehicle and conversion facts stays quiet', () => {
    const d = withBlocks((x) => {
      // hand-derived: 0.345 / 0.33 − 1 = +4.5 %, within ±7 %
      x.base_vehicle = { front_tyre_radius_m: 0.33, rear_tyre_radius_m: 0.33, circuit_split: 'front_rear', front_brake_type: 'disc', rear_brake_type: 'disc', abs: false, booster: true };
      x.conversion = { bias_adjuster: 'none', suspension_modified: false, booster_source: 'electric_vacuum_pump', engine_removed: true };
    });
    expect(pitfalls(d)).toEqual([]);
  });
});

describe('each pitfall fires on a design built to trigger it', () => {
  it('tyre rolling radius changed by more than 7 %', () => {
    // hand-derived: 0.345 / 0.32 − 1 = +7.8 % > 7 %
    const d = withBlocks((x) => (x.base_vehicle = { front_tyre_radius_m: 0.32 }));
    const p = pitfalls(d);
    expect(p.map((q) => q.code)).toEqual(['PITFALL_TYRE_RADIUS_CHANGED']);
    expect(p[0]!.path).toBe('axles.front.tyre_radius_m');
    expect(p[0]!.message).toContain('+7.8 %');
    expect(p[0]!.source).toMatch(/NSW/);
    // hand-derived: 0.345 / 0.3225 − 1 = +6.98 %, not above 7 %
    expect(codes(withBlocks((x) => (x.base_vehicle = { rear_tyre_radius_m: 0.3225 })))).toEqual([]);
  });
  it('a bias adjuster the driver can reach', () => {
    const p = pitfalls(withBlocks((x) => (x.conversion = { bias_adjuster: 'driver_adjustable' })));
    expect(p.map((q) => q.code)).toEqual(['PITFALL_BIAS_ADJUSTER_REACHABLE']);
    expect(p[0]!.source).toMatch(/IVA/);
    expect(codes(withBlocks((x) => (x.conversion = { bias_adjuster: 'locked' })))).toEqual([]);
  });
  it('ABS on the base vehicle but not working in the conversion', () => {
    const p = pitfalls(withBlocks((x) => (x.base_vehicle = { abs: true })));
    expect(p.map((q) => q.code)).toEqual(['PITFALL_ABS_LOST']);
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { abs: true };
      x.vehicle.abs = true;
    }))).toEqual([]);
  });
  it('stability control on the base vehicle, stated lost or not stated as working', () => {
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { stability_control: true };
      x.conversion = { stability_control_working: false };
    }))).toEqual(['PITFALL_STABILITY_CONTROL_LOST']);
    expect(codes(withBlocks((x) => (x.base_vehicle = { stability_control: true })))).toEqual(['PITFALL_STABILITY_CONTROL_LOST']);
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { stability_control: true };
      x.conversion = { stability_control_working: true };
    }))).toEqual([]);
  });
  it('a load-sensing valve on modified suspension (the demo has one)', () => {
    const p = pitfalls(withBlocks((x) => (x.conversion = { suspension_modified: true })));
    expect(p.map((q) => q.code)).toEqual(['PITFALL_LOAD_SENSING_SUSPENSION']);
    // a plain proportioning valve does not read the suspension
    expect(codes(withBlocks((x) => {
      x.conversion = { suspension_modified: true };
      x.hydraulics.rear_valve = { type: 'proportioning', knee_bar: 30, ratio: 0.3 };
    }))).toEqual([]);
  });
  it('a diagonal split turned into a front/rear split', () => {
    expect(codes(withBlocks((x) => (x.base_vehicle = { circuit_split: 'diagonal' })))).toEqual(['PITFALL_SPLIT_CHANGED']);
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { circuit_split: 'diagonal' };
      x.hydraulics.circuit_split = 'diagonal';
    }))).toEqual([]);
  });
  it('discs with a master cylinder from a drum system', () => {
    expect(codes(withBlocks((x) => (x.conversion = { master_cylinder_from_drum_system: true })))).toEqual(['PITFALL_DRUM_MASTER_CYLINDER']);
    // rear drums swapped for discs and the master cylinder not stated as replaced
    const swapped = pitfalls(withBlocks((x) => (x.base_vehicle = { rear_brake_type: 'drum' })));
    expect(swapped.map((q) => q.code)).toEqual(['PITFALL_DRUM_MASTER_CYLINDER']);
    expect(swapped[0]!.message).toContain('rear');
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { rear_brake_type: 'drum' };
      x.conversion = { master_cylinder_replaced: true };
    }))).toEqual([]);
  });
  it('booster removed', () => {
    expect(codes(withBlocks((x) => {
      x.base_vehicle = { booster: true };
      x.hydraulics.booster_ratio = 1;
      delete x.hydraulics.booster_runout_bar;
    }))).toEqual(['PITFALL_BOOSTER_REMOVED']);
  });
  it('booster without vacuum after the engine was removed', () => {
    expect(codes(withBlocks((x) => (x.conversion = { engine_removed: true, booster_source: 'engine_vacuum' })))).toEqual(['PITFALL_BOOSTER_NO_VACUUM']);
    expect(codes(withBlocks((x) => (x.conversion = { booster_source: 'none' })))).toEqual(['PITFALL_BOOSTER_NO_VACUUM']);
    // not stated at all after the engine came out: warned, never assumed fine
    expect(codes(withBlocks((x) => (x.conversion = { engine_removed: true })))).toEqual(['PITFALL_BOOSTER_NO_VACUUM']);
    expect(codes(withBlocks((x) => (x.conversion = { engine_removed: true, booster_source: 'electric_vacuum_pump' })))).toEqual([]);
  });
  it('every pitfall reaches the evaluate result with its source', () => {
    const r = evaluate(withBlocks((x) => (x.conversion = { bias_adjuster: 'driver_adjustable', suspension_modified: true })));
    expect(r.pitfalls.map((p) => p.code)).toEqual(['PITFALL_BIAS_ADJUSTER_REACHABLE', 'PITFALL_LOAD_SENSING_SUSPENSION']);
    for (const p of r.pitfalls) expect(p.source.length).toBeGreaterThan(20);
  });
});

describe('schema', () => {
  it('rejects a bad value naming the field, range and unit', () => {
    const d = structuredClone(demoDesign()) as Record<string, unknown>;
    d.hardware = { front: { expansion_per_bar_mm3: -1 } };
    const r = readDesign(d);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors[0]!.path).toBe('hardware.front.expansion_per_bar_mm3');
      expect(r.errors[0]!.message).toMatch(/-1 .*from 0 to 2000 mm³\/bar/);
    }
  });
  it('rejects an unknown conversion key', () => {
    const d = structuredClone(demoDesign()) as Record<string, unknown>;
    d.conversion = { bias: 'driver_adjustable' };
    expect(readDesign(d).ok).toBe(false);
  });
});
