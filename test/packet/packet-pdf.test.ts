// The evidence packet PDF, read back with pdftotext (poppler-utils). What it must contain is set by issue 8:
// the revision hash, every load state, every verdict and the caution (core/caution.ts); user text printed
// literally. Expected numbers come from evaluate() of the same design (the page and the CLI print the same
// result), formatted as the packet formats them (fmtNum: fixed decimals, trailing zeros dropped).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION, demoDesign, type DesignFile, type EvaluationResult, VERIFY_NOTE } from '../../core/index.ts';
import { buildPacket, evaluateForPacket } from '../../packet/build-packet.ts';
import { checkRows, fmtNum, packetContent } from '../../packet/packet-content.ts';
import { latin1, renderPacketPdf } from '../../packet/packet-pdf.ts';
import { revisionId } from '../../store/revision-id.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'lockstep-packet-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const DATE = new Date('2026-12-01T09:30:00Z');

function pdfText(pdf: Buffer, name: string): string {
  const file = path.join(dir, name);
  writeFileSync(file, pdf);
  return execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
}
const flat = (s: string) => s.replace(/\s+/g, ' ');

const USER_TEXT = 'Müller & Söhne <b>"Werkstatt"</b> \'O\'Neil\' </script>';

function design(): DesignFile {
  const d = demoDesign();
  d.identification = {
    vehicle_identification_number: 'TESTVIN1234567890',
    owner: USER_TEXT,
    modifier: 'Example conversions ltd',
    approval_regime: 'individual approval',
    approval_code: 'IA-2026/17',
  };
  return d;
}

describe('evidence packet PDF', () => {
  let text: string;
  let result: EvaluationResult;
  let rev: string;
  let pdf: Buffer;
  beforeAll(async () => {
    const d = design();
    const built = await buildPacket(d, { date: DATE });
    pdf = built.pdf;
    result = built.result;
    rev = built.revisionId;
    text = pdfText(pdf, 'packet.pdf');
  });

  it('is a PDF that pdftotext can open, with several pages', () => {
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const info = execFileSync('/usr/bin/pdfinfo', [path.join(dir, 'packet.pdf')], { encoding: 'utf8' });
    expect(Number(/Pages:\s+(\d+)/.exec(info)![1])).toBeGreaterThan(3);
  });
  it('prints the revision hash (SHA-256 of the canonical design JSON), version and injected date', () => {
    expect(rev).toBe(revisionId(design()));
    expect(text).toContain(rev);
    expect(text).toContain('2026-12-01 09:30 UTC');
    expect(text).toContain(result.lockstep_version);
  });
  it('names every load state and prints its critical braking rate and first locks as evaluate() gives them', () => {
    for (const s of result.load_states) {
      expect(text).toContain(`Load state "${s.id}"`);
      expect(flat(text)).toContain(s.label);
      expect(text).toContain(s.critical_braking_rate === null ? 'none' : fmtNum(s.critical_braking_rate, 4));
      for (const l of s.lock) expect(text).toContain(fmtNum(l.braking_rate, 4));
    }
  });
  it('prints every verdict of the checks, and the verify note beside partly verified or memory rules', () => {
    const rows = checkRows(result.checks);
    expect(rows.length).toBeGreaterThan(0); // the demo is an N1 van: the category's default rules apply
    const f = flat(text);
    for (const r of rows) expect(f).toContain(r.verdict);
    for (const v of new Set(rows.map((r) => r.verdict))) {
      const n = rows.filter((r) => r.verdict === v).length;
      expect(f.split(v).length - 1).toBeGreaterThanOrEqual(n);
    }
    if (result.checks.some((c) => c.status !== 'verified')) expect(f).toContain(VERIFY_NOTE);
  });
  it('states the verdict on its first page, in the words of the command line and the workbench (issue 12)', async () => {
    const page1 = flat(execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', '-f', '1', '-l', '1', path.join(dir, 'packet.pdf'), '-'], { encoding: 'utf8' }));
    // the demo fails on purpose: regeneration makes the unladen rear axle lock first at 20 and 50 km/h (core/demo.ts)
    expect(page1).toContain('Verdict: FAIL');
    expect(page1).toContain(result.verdict.summary);
    expect(result.verdict.failed.length).toBeGreaterThan(0);
    for (const f of result.verdict.failed) expect(page1).toContain(`FAIL ${f.description}`);
    // a passing design (no regeneration, the parking brake stated) says PASS on page 1 and nothing else
    const d = design();
    delete d.regen;
    const ok = await buildPacket(d, { date: DATE });
    expect(ok.result.verdict.overall).toBe('pass');
    const okFile = path.join(dir, 'pass.pdf');
    writeFileSync(okFile, ok.pdf);
    const okPage1 = flat(execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', '-f', '1', '-l', '1', okFile, '-'], { encoding: 'utf8' }));
    expect(okPage1).toContain('Verdict: PASS PASS: every check that applies passes');
    expect(okPage1).not.toMatch(/\bFAIL\b|NOT CHECKED/);
  });
  it('carries the caution', () => {
    expect(flat(text)).toContain(CAUTION);
  });
  it('prints user text literally (no markup interpreted, nothing escaped)', () => {
    expect(flat(text)).toContain(USER_TEXT);
    expect(text).toContain('IA-2026/17');
  });
  it('prints Latin-1 user text literally and the caution with the built-in font too (no TrueType font installed)', async () => {
    const d = design();
    const content = packetContent({ design: d, result: evaluateForPacket(d), revisionId: revisionId(d), date: DATE });
    const helv = await renderPacketPdf(content, DATE, { fonts: { regular: 'Helvetica', bold: 'Helvetica-Bold', unicode: false } });
    const t = flat(pdfText(helv, 'helvetica.pdf'));
    expect(t).toContain(USER_TEXT); // every character of USER_TEXT is in Latin-1
    expect(t).toContain(CAUTION);
    expect(t).toContain(revisionId(d));
    // outside Latin-1: the arrow of the diff notation and "≤" are spelled out
    expect(latin1('38 → 42 ≤ 50')).toBe('38 -> 42 <= 50');
  });
  it('has the sign-off block and a blank test sheet with the fields an inspector fills in', () => {
    const f = flat(text);
    for (const s of ['Sign-off', 'Road / roller brake test sheet', 'Measured deceleration m/s²', 'Pedal force N', 'Speed source', 'Test mass kg', 'Calibration date']) {
      expect(f).toContain(s);
    }
  });
  it('lists inputs with their provenance, "not stated" where the file gives none', () => {
    const f = flat(text);
    expect(f).toContain('measured: weighbridge, driver on board');
    expect(f).toContain('not stated');
    // 25.4 mm master cylinder bore is 0.0254 m in SI
    expect(f).toMatch(/hydraulics\.master_cylinder_bore_mm 25\.4 mm 0\.0254 m/);
  });
  it('is byte-identical for the same design and date (reproducible)', async () => {
    const again = await buildPacket(design(), { date: DATE });
    expect(again.pdf.equals(pdf)).toBe(true);
  });
  it('says so when no regulation checks are selected, and still prints every load state', async () => {
    const d = design();
    const r = { ...evaluateForPacket(d), checks: [] };
    const t = pdfText(await renderPacketPdf(packetContent({ design: d, result: r, revisionId: revisionId(d), date: DATE }), DATE), 'nochecks.pdf');
    expect(flat(t)).toContain('No regulation checks selected');
    for (const s of r.load_states) expect(t).toContain(`Load state "${s.id}"`);
  });
  it('prints optional result sections of other features when present (traction here, made up for the test)', async () => {
    const d = design();
    const r = { ...evaluateForPacket(d), traction: [{ adhesion: 0.8, drive: 'rear', max_acceleration_g: 0.4321 }] } as EvaluationResult;
    const t = flat(pdfText(await renderPacketPdf(packetContent({ design: d, result: r, revisionId: 'x'.repeat(64), date: DATE }), DATE), 'extra.pdf'));
    expect(t).toContain('Traction limits');
    expect(t).toContain('0.4321');
  });
});
