/** The differences of a compare as a short list, in the same colours as the canvas marks. */
import type { BoardDiff, CompareMark } from '../../../shared/render';
import { MARK_COLORS } from '../../../shared/render';

const show = (v: unknown) => (v === null || v === undefined ? '—' : typeof v === 'string' ? `“${v}”` : String(v));

function Row({ mark, children }: { mark: CompareMark; children: React.ReactNode }) {
  return (
    <li className="flex gap-2" data-mark={mark}>
      <span className="mt-1 h-2 w-2 shrink-0 rounded-full" style={{ background: MARK_COLORS[mark] }} aria-hidden="true" />
      <span>{children}</span>
    </li>
  );
}

export function CompareList({ diff }: { diff: BoardDiff }) {
  const rows = [
    ...diff.added.parts.map((p) => <Row key={`ap${p.id}`} mark="added">added {p.kind} <b>{p.label ?? p.id}</b></Row>),
    ...diff.removed.parts.map((p) => <Row key={`rp${p.id}`} mark="removed">removed {p.kind} <b>{p.label ?? p.id}</b></Row>),
    ...diff.changed.parts.map((p) => (
      <Row key={`cp${p.id}`} mark="changed">
        {p.kind} <b>{p.label ?? p.id}</b>: {p.moved ? 'moved' : ''}{p.moved && p.fields.some((f) => f.field !== 'x' && f.field !== 'y') ? '; ' : ''}
        {p.fields.filter((f) => f.field !== 'x' && f.field !== 'y').map((f) => `${f.field} ${show(f.from)} → ${show(f.to)}`).join('; ')}
      </Row>
    )),
    ...diff.added.wires.map((w) => <Row key={`aw${w.id}`} mark="added">added wire {w.from} → {w.to}</Row>),
    ...diff.removed.wires.map((w) => <Row key={`rw${w.id}`} mark="removed">removed wire {w.from} → {w.to}</Row>),
    ...diff.changed.wires.map((w) => <Row key={`cw${w.id}`} mark="changed">wire {w.id}: {w.fields.map((f) => `${f.field} ${show(f.from)} → ${show(f.to)}`).join('; ')}</Row>),
    ...diff.changed.meta.map((f) => <Row key={`m${f.field}`} mark="changed">{f.field} {show(f.from)} → {show(f.to)}</Row>),
  ];
  if (!rows.length) return <p className="text-xs text-slate-400" data-testid="compare-same">The live board is the same as this snapshot.</p>;
  return <ul className="max-h-40 space-y-0.5 overflow-y-auto font-mono text-[11px] text-slate-300" data-testid="compare-list">{rows}</ul>;
}
