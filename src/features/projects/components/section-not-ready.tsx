import { Badge } from '../../../components/ui/badge';
import { Panel } from '../../../components/ui/panel';
import type { ProjectSection } from './project-sections';

/** Stands in for an engineering page that does not exist yet; it shows no data, real or made up. */
export function SectionNotReady({ section }: { section: ProjectSection }) {
  return (
    <Panel title={section.label} actions={<Badge tone="ember">Not yet available</Badge>}>
      <div className="flex flex-col gap-3 rounded-plate border border-dashed border-paper-line bg-paper px-5 py-6">
        <p className="text-body font-medium text-ink">This part of Stillspan is not yet available.</p>
        <div className="max-w-prose text-small text-ink-soft">
          <p className="font-semibold text-ink-soft">What this page will hold</p>
          <p className="mt-1">{section.purpose}</p>
        </div>
        <p className="text-small text-ink-muted">Nothing is stored or calculated here yet.</p>
      </div>
    </Panel>
  );
}
