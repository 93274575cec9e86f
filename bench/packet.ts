/**
 * Evidence-packet benchmark (issue 14): the demo's packet from the design to the PDF bytes, in process, on one
 * core (one thread, one packet after another), split into its steps: evaluate with curves, the document model
 * (packet/packet-content.ts), the PDF (packet/packet-pdf.ts). Target: the whole packet under 1.5 s. The first
 * packet (fonts read and parsed, modules warm) is printed apart from the median of BENCH_PACKET_RUNS (default 7).
 * Prints figures only; nothing is asserted.
 */
import { demoDesign } from '../core/index.ts';
import { evaluateForPacket } from '../packet/build-packet.ts';
import { packetContent } from '../packet/packet-content.ts';
import { renderPacketPdf } from '../packet/packet-pdf.ts';

const TARGET_MS = 1500;

async function once(): Promise<{ evaluate: number; content: number; pdf: number; total: number; bytes: number }> {
  const design = demoDesign();
  const date = new Date('2026-12-01T00:00:00Z');
  const t0 = performance.now();
  const result = evaluateForPacket(design);
  const t1 = performance.now();
  const content = packetContent({ design, result, date });
  const t2 = performance.now();
  const pdf = await renderPacketPdf(content, date);
  const t3 = performance.now();
  return { evaluate: t1 - t0, content: t2 - t1, pdf: t3 - t2, total: t3 - t0, bytes: pdf.length };
}

export async function run(): Promise<void> {
  const runs = Number(process.env.BENCH_PACKET_RUNS ?? 7);
  const first = await once();
  const rs: Awaited<ReturnType<typeof once>>[] = [];
  for (let i = 0; i < runs; i++) rs.push(await once());
  const mid = (k: 'evaluate' | 'content' | 'pdf' | 'total') => rs.map((r) => r[k]).sort((a, b) => a - b)[rs.length >> 1]!;
  const f = (ms: number) => `${ms.toFixed(0)} ms`;
  console.log(`first packet (cold): ${f(first.total)} (evaluate ${f(first.evaluate)}, content ${f(first.content)}, PDF ${f(first.pdf)}), ${first.bytes} bytes`);
  console.log(
    `median of ${runs}: ${f(mid('total'))} (evaluate ${f(mid('evaluate'))}, content ${f(mid('content'))}, PDF ${f(mid('pdf'))}); target < ${TARGET_MS} ms: ${mid('total') < TARGET_MS ? 'met' : 'NOT met'}`,
  );
}
