// Sources: CSV per RFC 4180 §2 (fields with comma, quote or line break enclosed in quotes; quotes doubled; CRLF line
// ends) and the OWASP "CSV Injection" advice (text starting with = + - @ is prefixed so a spreadsheet does not
// run it as a formula). Curve values are compared with evaluate(design, { curves: true }) of the same design.
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate } from '../../core/index.ts';
import { checksCsv, csv, csvCell, curvesCsv, designJson } from '../../packet/exports.ts';

describe('csvCell', () => {
  it('quotes commas, quotes and line breaks, doubling quotes (RFC 4180 §2.6, §2.7)', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
  });
  it('keeps numbers as numbers, negative ones too, and writes null and non-finite as empty', () => {
    expect(csvCell(-0.25)).toBe('-0.25');
    expect(csvCell(null)).toBe('');
    expect(csvCell(Number.NaN)).toBe('');
  });
  it('defuses text a spreadsheet would run as a formula (OWASP CSV injection)', () => {
    expect(csvCell('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('-5 mm')).toBe('-5 mm'); // a signed number is not a formula
  });
  it('ends every row with CRLF (RFC 4180 §2.1)', () => {
    expect(csv(['a', 'b'], [[1, 2]])).toBe('a,b\r\n1,2\r\n');
  });
});

describe('exports', () => {
  it('design JSON parses back to the design', () => {
    const d = demoDesign();
    expect(JSON.parse(designJson(d))).toEqual(d);
  });
  it('curves CSV has one row per braking rate and load state, with the values evaluate() gives', () => {
    const d = demoDesign();
    const r = evaluate(d, { curves: true });
    const lines = curvesCsv(r).trimEnd().split('\r\n');
    const expectedRows = r.load_states.reduce((n, s) => n + s.curves!.braking_rate.length, 0);
    expect(lines).toHaveLength(1 + expectedRows);
    const c = r.load_states[1]!.curves!;
    const i = c.braking_rate.indexOf(0.5);
    const row = lines.find((l) => l.startsWith('laden,0.5,'))!.split(',');
    expect(Number(row[2])).toBe(c.front_utilisation[i]);
    expect(Number(row[10])).toBe(c.pedal_force_n[i]);
  });
  it('curves CSV leaves utilisation beyond rear lift-off empty (null in the result)', () => {
    const d = demoDesign();
    const r = evaluate(d, { curves: true });
    r.load_states[0]!.curves!.rear_utilisation[3] = null;
    const line = curvesCsv(r).split('\r\n')[4]!.split(',');
    expect(line[3]).toBe('');
  });
  it('checks CSV has one row per check and the verify note for partly verified or memory rules', () => {
    const r = evaluate(demoDesign());
    const lines = checksCsv(r).trimEnd().split('\r\n');
    expect(lines).toHaveLength(1 + r.checks.length);
    const partial = r.checks.findIndex((c) => c.status !== 'verified');
    if (partial >= 0) expect(lines[partial + 1]).toContain('verify against the current official text');
  });
});
