import type { CreateLoadCaseInput, SavedLoadCase, UpdateLoadCaseInput } from '../../../../shared/contracts';
import { loadCaseSchema } from '../../../../shared/contracts/compute-design';
import { trafficClasses } from '../../../../shared/engine/loads/pedestrian-crowd';
import { sameValue } from '../../../components/forms/changes';
import type { LoadCaseFormValues } from './load-case-form';

type FormSpec = LoadCaseFormValues['spec'];

/**
 * A stored load case as the form's values. A crowd given by a density keeps a traffic class of its guide in the
 * form as well, so that switching to "the guide's traffic class" shows a real choice; only one of them is sent.
 */
export function loadCaseToForm(loadCase: SavedLoadCase): LoadCaseFormValues {
  const stored = loadCase.spec;
  const spec = { ...stored } as unknown as FormSpec;
  if (stored.kind === 'crowd' || stored.kind === 'lateral') {
    const byDensity = stored.densityPerM2 !== undefined;
    if (byDensity && spec.trafficClass === undefined) {
      spec.trafficClass = trafficClasses.find((entry) => entry.guide === stored.guide)?.name;
    }
    return { name: loadCase.name, densityBy: byDensity ? 'density' : 'class', spec };
  }
  return { name: loadCase.name, densityBy: 'class', spec };
}

/**
 * The PATCH body of a change to `loadCase` (as the form was opened on it) from the body the form makes: the version,
 * the name when it differs, and the whole spec when any of it differs (a spec is replaced as a whole). Specs are
 * compared as the engine's schema reads them, so a default written out (harmonic 1) is no change.
 */
export function loadCaseChanges(loadCase: SavedLoadCase, body: CreateLoadCaseInput): UpdateLoadCaseInput {
  const changes: UpdateLoadCaseInput = { version: loadCase.version };
  const name = body.name.trim();
  if (name !== loadCase.name) changes.name = name;
  const parsed = loadCaseSchema.safeParse(body.spec);
  if (!parsed.success || !sameValue(parsed.data, loadCase.spec)) changes.spec = body.spec;
  return changes;
}
