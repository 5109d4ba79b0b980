import type { ProjectKind } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { formatProjectKind } from '../../../lib/format';

/** The structure kind of a project, each kind in its own tone wherever projects are listed or headed. */
export function ProjectKindBadge({ kind }: { kind: ProjectKind }) {
  return <Badge tone={kind === 'footbridge' ? 'tide' : 'ember'}>{formatProjectKind(kind)}</Badge>;
}
