/**
 * The bar over the canvas while a module is open: the breadcrumb back out (Board › outer › inner) and,
 * for editors, where the open module stands with the team library and "Publish to library".
 */
import { useQuery } from '@tanstack/react-query';
import type { Module } from '../../../../shared/board';
import { libraryQueryOptions, libraryStanding, PublishModuleButton, standingText } from '../../library';

interface Props {
  /** the open modules, outermost first */
  path: string[];
  module: Module;
  titleOf(id: string): string;
  onPath(path: string[]): void;
  boardId: number;
  canEdit: boolean;
}

function Standing({ boardId, module }: { boardId: number; module: Module }) {
  const list = useQuery(libraryQueryOptions());
  return (
    <span className="font-mono text-[10px] text-slate-400" data-testid="module-bar-standing">
      {list.data ? standingText(libraryStanding(list.data, boardId, module)) : ''}
    </span>
  );
}

export function ModuleBar({ path, module, titleOf, onPath, boardId, canEdit }: Props) {
  return (
    <div className="absolute left-3 top-3 z-10 flex items-center gap-3 rounded bg-mat-800/95 px-2 py-1 text-xs text-slate-300 shadow" data-testid="module-bar">
      <nav className="flex items-center gap-1" aria-label="Module breadcrumb" data-testid="module-breadcrumb">
        <button type="button" className="rounded px-1 text-amber-300 hover:bg-mat-700" data-testid="breadcrumb-board" onClick={() => onPath([])}>Board</button>
        {path.map((id, i) => (
          <span key={id} className="flex items-center gap-1">
            <span aria-hidden="true">›</span>
            {i === path.length - 1 ? (
              <span className="px-1 font-mono text-slate-100" data-testid="breadcrumb-current">{titleOf(id)}</span>
            ) : (
              <button type="button" className="rounded px-1 text-amber-300 hover:bg-mat-700" onClick={() => onPath(path.slice(0, i + 1))}>{titleOf(id)}</button>
            )}
          </span>
        ))}
      </nav>
      {canEdit && (
        <>
          <span className="h-4 w-px bg-mat-600" aria-hidden="true" />
          <Standing boardId={boardId} module={module} />
          <PublishModuleButton boardId={boardId} module={module} />
        </>
      )}
    </div>
  );
}
