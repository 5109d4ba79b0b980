import { Link } from 'react-router-dom';
import type { Structure } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { formatQuantity } from '../../../lib/format';
import { structureKindLabels } from './labels';

export function StructureList({ projectId, structures }: { projectId: string; structures: Structure[] }) {
  return (
    <ul aria-label="Structures" className="grid gap-4 md:grid-cols-2">
      {structures.map((structure) => (
        <li key={structure.id} className="group relative flex flex-col gap-2 rounded-plate border border-paper-line bg-paper-raised p-5 hover:shadow-md">
          <div className="flex items-start justify-between gap-3">
            <h3 className="text-lead font-semibold">
              <Link
                to={`/projects/${projectId}/structures/${structure.id}`}
                className="text-ink after:absolute after:inset-0 after:content-[''] group-hover:text-tide-800"
              >
                {structure.name}
              </Link>
            </h3>
            <Badge tone="tide">{structureKindLabels[structure.kind]}</Badge>
          </div>
          <p className="text-small text-ink-soft">
            {[
              structure.spanM !== null ? `span ${formatQuantity(structure.spanM, 'm')}` : null,
              structure.widthM !== null ? `width ${formatQuantity(structure.widthM, 'm')}` : null,
              structure.deckAreaM2 !== null ? `deck ${formatQuantity(structure.deckAreaM2, 'm²')}` : null,
            ]
              .filter(Boolean)
              .join(' · ') || 'No dimensions given'}
          </p>
          {structure.notes ? <p className="line-clamp-2 text-small text-ink-muted">{structure.notes}</p> : null}
        </li>
      ))}
    </ul>
  );
}
