import path from 'node:path';
import PDFDocument from 'pdfkit';
import type { AuditDetail, EdgeRow } from '../../lib/schemas/audit';

const fontDir = path.resolve(__dirname, '../../node_modules/@expo-google-fonts');
const fonts = {
  text: path.join(fontDir, 'space-grotesk/400Regular/SpaceGrotesk_400Regular.ttf'),
  bold: path.join(fontDir, 'space-grotesk/700Bold/SpaceGrotesk_700Bold.ttf'),
  // JetBrains Mono carries the Greek letters (λ, ε, τ) the UI face lacks.
  mono: path.join(fontDir, 'jetbrains-mono/400Regular/JetBrainsMono_400Regular.ttf'),
};
const ink = '#1D2733', soft = '#3C4A5A', rule = '#D6CFBF', rust = '#A84B2A';

export const CAUTION =
  'These figures support, and do not replace, review by a licensed engineer and the codes and standards that apply where the system is built and run.';

const glyph: Record<string, string> = { linear: '—', 'square-root': '√', 'cube-root': '³√', quadratic: '²', flat: '·', other: '?' };
const n = (x: number | null | undefined, d = 4) => (x === null || x === undefined ? '—' : Math.abs(x) < 1e-3 && x !== 0 ? x.toExponential(2) : x.toPrecision(d));

/** The sign-off report: summary, spectrum figure, flagged edges, the seal, the caution. */
export function auditReportPdf(audit: AuditDetail, flagged: EdgeRow[]): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info: { Title: `Hairline audit ${audit.id}`, Subject: `${audit.networkName} v${audit.version}` } });
  doc.registerFont('text', fonts.text).registerFont('bold', fonts.bold).registerFont('mono', fonts.mono);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  doc.font('bold').fontSize(20).fillColor(ink).text(`Audit ${audit.id} · ${audit.networkName}`, { continued: false });
  doc.font('text').fontSize(10).fillColor(soft).text(`Network version ${audit.version} · Laplacian convention: ${audit.convention === 'in' ? 'in-degree (a node’s row holds the edges it receives)' : 'out-degree (a node’s row holds the edges it sends)'}`);
  doc.text(`Started by ${audit.startedBy.name} on ${audit.createdAt} · state: ${audit.state}`);
  doc.moveDown(0.6);
  caution(doc);

  section(doc, 'Summary');
  const s = audit.settings;
  doc.font('mono').fontSize(10).fillColor(ink);
  doc.text(`λ2 = ${audit.lambda2 ? `${n(audit.lambda2.re, 8)}${audit.lambda2.im ? ` ± ${n(Math.abs(audit.lambda2.im), 4)}i` : ''}` : '—'}   cluster size ${audit.cluster?.size ?? '—'}   spread ${n(audit.cluster?.spread ?? null, 2)}`);
  doc.text(`ladder ε = w̄·10^−t, t = ${s.ladder.from}…${s.ladder.to} step ${s.ladder.step}; signs ${s.signs.join(', ')}; τ = ${s.tolerance * 100} % of Re λ2`);
  doc.text(`edges ${audit.progress.total}; ${Object.entries(audit.classCounts).map(([k, v]) => `${k} ${v}`).join(', ')}; flagged ${audit.flaggedCount}`);
  if (audit.rooted === false) doc.fillColor(rust).text(`Not rooted: λ2 = 0. Cut off: ${audit.cutOff.join(', ')}`).fillColor(ink);

  section(doc, 'Spectrum');
  spectrumFigure(doc, audit);

  section(doc, `Flagged edges (${flagged.length})`);
  if (flagged.length === 0) doc.font('text').fontSize(10).text('No edge needs a disposition: every response is linear or flatter.');
  for (const e of flagged) {
    if (doc.y > 740) doc.addPage();
    doc.font('mono').fontSize(9).fillColor(ink).text(
      `#${e.edgeIndex} ${e.source} → ${e.target}  w=${n(e.weight)}  ${glyph[e.class] ?? ''} ${e.class}  +ε:${e.plusClass ?? '—'}(${n(e.plusExponent, 3)})  −ε:${e.minusClass ?? '—'}(${n(e.minusExponent, 3)})  tol ±${n(e.tolerance, 3)}${e.toleranceRel !== null ? ` (${n(e.toleranceRel * 100, 3)} %)` : ''}`,
    );
    doc.font('text').fontSize(9).fillColor(soft).text(e.disposition ? `   ${e.disposition.kind} — ${e.disposition.note} (${e.disposition.by}, ${e.disposition.at})` : '   no disposition recorded', { indent: 12 });
  }

  section(doc, 'Sign-off');
  if (audit.lock) {
    doc.font('text').fontSize(10).fillColor(ink).text(`Approved and sealed by ${audit.lock.by.name} at ${audit.lock.at}.`);
    doc.text(`Comment: ${audit.lock.comment}`);
    doc.font('mono').fontSize(8).text(`SHA-256 ${audit.lock.hash}`);
    doc.font('text').fontSize(9).fillColor(audit.hashCheck?.matches ? soft : rust).text(audit.hashCheck?.matches ? 'Recomputed now: the seal matches the stored results and dispositions.' : 'Recomputed now: the seal does NOT match — the record was changed after sealing.');
  } else {
    doc.font('text').fontSize(10).fillColor(rust).text('Not sealed: this report is a draft and carries no approval.');
  }
  doc.moveDown();
  caution(doc);
  doc.end();
  return done;
}

function section(doc: PDFKit.PDFDocument, title: string) {
  if (doc.y > 700) doc.addPage();
  doc.moveDown(0.8);
  doc.font('bold').fontSize(13).fillColor(ink).text(title);
  doc.moveTo(50, doc.y + 2).lineTo(545, doc.y + 2).strokeColor(rule).lineWidth(0.7).stroke();
  doc.moveDown(0.5);
}

function caution(doc: PDFKit.PDFDocument) {
  doc.font('text').fontSize(9).fillColor(rust).text(`Caution: ${CAUTION}`).fillColor(ink);
}

function spectrumFigure(doc: PDFKit.PDFDocument, audit: AuditDetail) {
  const pts = audit.spectrum;
  const x0 = 60, y0 = doc.y + 5, w = 470, h = 150;
  doc.rect(x0, y0, w, h).strokeColor(rule).lineWidth(0.7).stroke();
  if (pts.length === 0) {
    doc.y = y0 + h + 10;
    return;
  }
  const reMax = Math.max(...pts.map((p) => p.re), 1e-9);
  const imMax = Math.max(...pts.map((p) => Math.abs(p.im)), 1e-9);
  const X = (re: number) => x0 + 8 + (re / (reMax * 1.05)) * (w - 16);
  const Y = (im: number) => y0 + h / 2 - (im / (imMax * 1.15)) * (h / 2 - 6);
  doc.moveTo(x0, Y(0)).lineTo(x0 + w, Y(0)).strokeColor(rule).stroke();
  const l2 = audit.lambda2;
  const spread = Math.max(audit.cluster?.spread ?? 0, 1e-9) * 2;
  for (const p of pts) {
    const inCluster = l2 && Math.hypot(p.re - l2.re, p.im - l2.im) <= spread;
    if (inCluster) {
      const cx = X(p.re), cy = Y(p.im);
      doc.polygon([cx, cy - 4], [cx + 4, cy], [cx, cy + 4], [cx - 4, cy]).fillColor(rust).fill();
    } else doc.circle(X(p.re), Y(p.im), 2).fillColor(soft).fill();
  }
  doc.font('mono').fontSize(8).fillColor(soft);
  doc.text(`Re λ from 0 to ${n(reMax, 3)} · Im λ ±${n(imMax, 3)} · ◆ λ2 cluster, ● other eigenvalues`, x0, y0 + h + 4, { width: w });
  doc.x = 50;
}
