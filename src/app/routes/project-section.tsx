import type { ProjectSection } from '../../features/projects/components/project-sections';
import { SectionNotReady } from '../../features/projects/components/section-not-ready';

export function ProjectSectionRoute({ section }: { section: ProjectSection }) {
  return <SectionNotReady section={section} />;
}
