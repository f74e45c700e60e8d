/** The board's modules (id, title, origin), kept up to date from the document while `active`. */
import { useEffect, useState } from 'react';
import type * as Y from 'yjs';
import { modulesMap, readModules, type Module } from '../../../shared/board';

export type ModuleSummary = Pick<Module, 'id' | 'title' | 'origin'>;

const summaries = (doc: Y.Doc): ModuleSummary[] => readModules(doc).map(({ id, title, origin }) => ({ id, title, ...(origin ? { origin } : {}) }));

export function useBoardModules(doc: Y.Doc, active: boolean): ModuleSummary[] {
  const [list, setList] = useState<ModuleSummary[]>(() => (active ? summaries(doc) : []));
  useEffect(() => {
    if (!active) return;
    const map = modulesMap(doc);
    let raf = 0;
    // one read per frame however many edits a frame brings (editing inside a module changes this map deeply)
    const refresh = () => {
      const next = summaries(doc);
      setList((prev) => (JSON.stringify(prev) === JSON.stringify(next) ? prev : next));
    };
    const update = () => { if (!raf) raf = requestAnimationFrame(() => { raf = 0; refresh(); }); };
    refresh();
    map.observeDeep(update);
    return () => { map.unobserveDeep(update); if (raf) cancelAnimationFrame(raf); };
  }, [doc, active]);
  return list;
}
