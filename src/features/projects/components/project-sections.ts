/** The pages a project holds. Those not yet available say what they will hold. */
export interface ProjectSection {
  slug: string;
  label: string;
  available: boolean;
  /** What the page will let the team do, in the trade's words. */
  purpose: string;
}

export const projectSections: ProjectSection[] = [
  { slug: '', label: 'Overview', available: true, purpose: 'The project’s name, structure kind, place and description.' },
  { slug: 'members', label: 'Members', available: true, purpose: 'The people who work on the project.' },
  {
    slug: 'structures',
    label: 'Structures and modes',
    available: true,
    purpose:
      'The structures and their modes — natural frequency, modal mass, damping ratio and direction — typed in from a finite-element model, derived from a simple beam or taken from a lumped model.',
  },
  {
    slug: 'load-cases',
    label: 'Load cases',
    available: true,
    purpose: 'Single walker, group, crowd by density class, jogger, lateral crowd and floor walking, each from a named guide.',
  },
  {
    slug: 'comfort-criteria',
    label: 'Comfort criteria',
    available: true,
    purpose: 'The acceleration limits the owner accepts: a guide’s comfort class, a code limit or custom values.',
  },
  {
    slug: 'tuning-variants',
    label: 'Tuning variants',
    available: true,
    purpose:
      'Mass ratio, tuning method and number of units; response with and without the damper over the pacing band, stroke and detuning robustness, compared side by side.',
  },
  {
    slug: 'hardware-sheet',
    label: 'Hardware sheet',
    available: true,
    purpose: 'Moving mass, spring rate, damper coefficient, static deflection, design stroke and tuning range for the fabricator.',
  },
  {
    slug: 'sign-off',
    label: 'Sign-off',
    available: true,
    purpose: 'Submit the comfort criteria and the chosen design to the owner, who approves them or returns them with a comment.',
  },
  {
    slug: 'site-records',
    label: 'Site records',
    available: true,
    purpose:
      'Measured acceleration records from site: time history, spectrum and decay, frequency and damping ratio compared with the design mode, and the re-tune of the damper.',
  },
  {
    slug: 'history',
    label: 'History',
    available: true,
    purpose: 'Every change of the project’s things: who made it, when, and the values before and after.',
  },
];
