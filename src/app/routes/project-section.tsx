import { projectSections } from '../../features/projects/components/project-sections';
import { SectionNotReady } from '../../features/projects/components/section-not-ready';

/** The page component of one engineering section still to come, by its slug. */
export function projectSectionRoute(slug: string) {
  const section = projectSections.find((entry) => entry.slug === slug);
  if (!section) throw new Error(`No project section "${slug}"`);
  return function ProjectSectionRoute() {
    return <SectionNotReady section={section} />;
  };
}
