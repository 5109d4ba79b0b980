import type { BeamSupport } from '../../../../shared/engine/beam';
import type { LumpedModel, ModeSource, SavedMode, StructureKind } from '../../../../shared/contracts';
import { formatNumber } from '../../../lib/format';

export const structureKindLabels: Record<StructureKind, string> = {
  'footbridge-span': 'Footbridge span',
  'floor-bay': 'Floor bay',
};

export const directionLabels: Record<SavedMode['direction'], string> = {
  vertical: 'Vertical',
  lateral: 'Lateral',
  longitudinal: 'Longitudinal',
  torsional: 'Torsional',
};

export const beamSupportLabels: Record<BeamSupport, string> = {
  'simply-supported': 'Simply supported',
  'fixed-fixed': 'Fixed at both ends',
  cantilever: 'Cantilever',
};

export const sourceKindLabels: Record<ModeSource['kind'], string> = {
  typed: 'Typed in',
  beam: 'Beam',
  'lumped-model': 'Lumped model',
};

/** Where a mode's numbers came from, in one line with units. */
export function describeModeSource(source: ModeSource, models: readonly LumpedModel[] | undefined): string {
  switch (source.kind) {
    case 'typed':
      return 'Typed in (e.g. from a finite-element model)';
    case 'beam':
      return (
        `${beamSupportLabels[source.support]} beam, mode ${source.modeNumber}: L = ${formatNumber(source.lengthM)} m, ` +
        `EI = ${formatNumber(source.bendingStiffnessNM2)} N·m², m = ${formatNumber(source.massPerLengthKgPerM)} kg/m`
      );
    case 'lumped-model': {
      const model = models?.find((entry) => entry.id === source.modelId);
      const dof = model?.dofLabels?.[source.dofIndex] ?? `DOF ${source.dofIndex + 1}`;
      return `${model ? `Model “${model.name}”` : 'A lumped model'}, mode ${source.modeNumber} at ${dof}`;
    }
  }
}
