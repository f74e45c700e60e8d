import type { FamilyData } from '../families';
import type { Netlist, SettleReport } from '../types';

export type BadgeTone = 'conflict' | 'oscillating' | 'undriven' | 'info';
export interface Badge {
  tone: BadgeTone;
  text: string;
}

const RANK: Record<BadgeTone, number> = { conflict: 3, oscillating: 2, undriven: 1, info: 0 };

function add(out: Map<string, Badge>, partId: string, tone: BadgeTone, text: string): void {
  const had = out.get(partId);
  if (!had) out.set(partId, { tone, text });
  else if (!had.text.includes(text)) out.set(partId, { tone: RANK[tone] > RANK[had.tone] ? tone : had.tone, text: `${had.text} ${text}` });
}

const pinName = (r: { part: string; pin: string }) => `${r.part}.${r.pin}`;

/**
 * Badges for the canvas: one per part whose pin sits on a troubled net, with a sentence saying what is
 * wrong and what the net reads. A part on several troubled nets gets the most serious tone and all texts.
 */
export function partBadges(netlist: Netlist, report: SettleReport, family: FamilyData): Map<string, Badge> {
  const out = new Map<string, Badge>();
  const byName = new Map(netlist.nets.map((n) => [n.name, n]));
  for (const name of report.conflicts) {
    const net = byName.get(name);
    if (!net) continue;
    const text = `${net.drivers.length === 2 ? 'Two' : net.drivers.length} outputs drive this net (${net.drivers.map(pinName).join(', ')}): it reads X.`;
    for (const r of [...net.drivers, ...net.readers]) add(out, r.part, 'conflict', text);
  }
  for (const name of report.oscillating) {
    const net = byName.get(name);
    if (!net) continue;
    const text = `Net ${name} does not settle: it keeps changing (a feedback loop with an odd number of inversions, or a race).`;
    for (const r of net.drivers.length ? net.drivers : net.readers) add(out, r.part, 'oscillating', text);
  }
  for (const ref of report.undrivenInputs) {
    const dot = ref.lastIndexOf('.');
    if (dot <= 0) continue;
    const text = `Input ${ref.slice(dot + 1)} is not driven (${family.title}: an open input reads ${family.floating}).`;
    add(out, ref.slice(0, dot), 'undriven', text);
  }
  return out;
}
