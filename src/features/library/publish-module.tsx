/**
 * "Publish to library" for one module of a board: the module (with the modules it uses) goes into the
 * board owner's team library as a new entry, or as the next version of its entry. Editors only; the
 * caller leaves it out for viewers (the server answers 403 all the same).
 */
import { toast } from 'sonner';
import type { Module } from '../../../shared/board';
import { usePublishModule } from './api';

interface Props {
  boardId: number;
  module: Pick<Module, 'id' | 'title'>;
  className?: string;
}

export function PublishModuleButton({ boardId, module, className }: Props) {
  const publish = usePublishModule();
  const onClick = () => publish.mutate({ boardId, moduleId: module.id }, {
    onSuccess: (entry) => toast.success(`Published “${entry.title}” to the library as v${entry.version}`),
    onError: (err) => toast.error(`Could not publish “${module.title}”: ${err.message}`),
  });
  return (
    <button type="button" onClick={onClick} disabled={publish.isPending} data-testid={`publish-${module.id}`}
      title={`Publish “${module.title}” to the team library (a newer version if it is there already)`}
      className={className ?? 'rounded border border-amber-glow/60 px-1.5 py-0.5 text-amber-300 hover:bg-mat-700 disabled:opacity-50'}>
      {publish.isPending ? 'Publishing…' : 'Publish to library'}
    </button>
  );
}
