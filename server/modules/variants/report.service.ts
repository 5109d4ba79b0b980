/**
 * The engineer's design report of a tuning variant: everything the PDF (report.pdf.ts) prints, read through the same
 * paths as the variant's page — the variant with its result (recomputed first when its inputs changed), its mode,
 * load cases and comfort criteria as stored, and each load case's plot data from the curves computation the page
 * draws (shared/compute/variant.ts `computeVariantCurves`, on the engine's worker pool). Nothing is computed here.
 */
import type { Database } from '../../db/client';
import { HttpError } from '../../lib/http-error';
import { fileNameSlug } from '../../lib/file-name';
import type { CurrentUser } from '../../middleware/auth';
import type { EnginePool } from '../../workers/engine-pool';
import type { SavedMode } from '../../../shared/contracts/model';
import type { Variant, VariantCurves, VariantResult } from '../../../shared/contracts/variants';
import { variantEngineVersion, type CriteriaSpec, type LoadCaseSpec } from '../../../shared/compute/variant';
import { findProject } from '../projects/projects.repository';
import { findStructure } from '../structures/structures.repository';
import { requireProjectScope } from '../structures/structures.service';
import { findLumpedModel } from '../lumped-models/lumped-models.repository';
import { toSavedMode } from '../modes/modes.service';
import * as repository from './variants.repository';
import { getVariant, noResultReason, variantCurvesOfEveryLoadCase } from './variants.service';

export interface VariantReportData {
  projectName: string;
  structure: { name: string; kind: string; spanM: number | null; widthM: number | null; deckAreaM2: number | null } | null;
  variant: Variant & { result: VariantResult };
  mode: SavedMode;
  /** The lumped model a derived mode comes from: its name, DOF count and the label of the damper's DOF. */
  lumpedModel: { name: string; dofCount: number; dofLabel: string | null } | null;
  loadCases: Array<{ id: string; name: string; spec: LoadCaseSpec }>;
  criteria: { name: string; status: string; spec: CriteriaSpec };
  /** The plot data of each load case, in the variant's order. */
  curves: VariantCurves[];
  /**
   * The engine version that computed the plots when it differs from the stored result's (an approved design keeps the
   * result it was approved with, docs/decisions/0019-sign-off-freeze.md); null otherwise.
   */
  plotEngineVersion: string | null;
  generatedAt: Date;
  generatedFor: { name: string; email: string };
}

const inputsMissing = () => new HttpError(409, 'variant_inputs_missing', 'A mode, load case or criteria of this tuning variant is missing');

export async function getVariantReport(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, variantId: string): Promise<VariantReportData> {
  const variant = await getVariant(db, engine, user, projectId, variantId);
  if (!variant.result) {
    const why = noResultReason(variant);
    throw new HttpError(409, 'variant_without_result', `The design report needs a computed result, and this tuning variant has none: ${why}; change it so that it computes`, [
      { path: 'variantId', message: `has no result: ${why}` },
    ]);
  }
  const scope = await requireProjectScope(db, user, projectId);
  const project = await findProject(db, user.organisationId, projectId);
  const modeRow = await repository.findProjectMode(db, scope, variant.modeId);
  const criteriaRow = await repository.findProjectCriteria(db, scope, variant.criteriaId);
  const loadCaseRows = await repository.findProjectLoadCases(db, scope, variant.loadCaseIds);
  if (!project || !modeRow || !criteriaRow) throw inputsMissing();
  const loadCases = variant.loadCaseIds.map((id) => {
    const row = loadCaseRows.find((r) => r.id === id);
    if (!row) throw inputsMissing();
    return { id: row.id, name: row.name, spec: row.spec as LoadCaseSpec };
  });
  const mode = toSavedMode(modeRow, projectId);
  const structureRow = await findStructure(db, scope, mode.structureId);
  let lumpedModel: VariantReportData['lumpedModel'] = null;
  if (mode.source.kind === 'lumped-model') {
    const model = await findLumpedModel(db, { ...scope, structureId: mode.structureId }, mode.source.modelId);
    if (model) {
      lumpedModel = { name: model.name, dofCount: model.massMatrixKg.length, dofLabel: model.dofLabels?.[mode.source.dofIndex] ?? null };
    }
  }

  // The page's own plot data (the curves route's), every load case from the variant's inputs read once.
  const curves = await variantCurvesOfEveryLoadCase(db, engine, user, projectId, variantId);
  // The curves are computed from the inputs as they are now: a change made meanwhile would mix two designs. (An
  // approved design computed by an earlier engine keeps its stored result; its plots are then the present engine's,
  // and the report says so.)
  const tmd = variant.result.tmd;
  const sameEngine = variant.result.engineVersion === variantEngineVersion;
  if (sameEngine && curves.some((c) => c.tmd.massKg !== tmd.massKg || c.tmd.frequencyHz !== tmd.frequencyHz || c.tmd.dampingRatio !== tmd.dampingRatio)) {
    throw new HttpError(409, 'variant_changed', 'The tuning variant changed while its report was being prepared; ask for the report again');
  }

  return {
    projectName: project.name,
    structure: structureRow
      ? { name: structureRow.name, kind: structureRow.kind, spanM: structureRow.spanM, widthM: structureRow.widthM, deckAreaM2: structureRow.deckAreaM2 }
      : null,
    variant: variant as Variant & { result: VariantResult },
    mode,
    lumpedModel,
    loadCases,
    criteria: { name: criteriaRow.name, status: criteriaRow.status, spec: criteriaRow.spec as CriteriaSpec },
    curves,
    plotEngineVersion: sameEngine ? null : variantEngineVersion,
    generatedAt: new Date(),
    generatedFor: { name: user.name, email: user.email },
  };
}

/** A file name from the project's and the variant's names and the report's revision (letters, digits, dashes). */
export function variantReportFileName(data: VariantReportData): string {
  const slug = (text: string) => fileNameSlug(text, 50);
  return `${slug(data.projectName) || 'project'}-${slug(data.variant.name) || 'variant'}-design-report-${variantReportRevision(data.variant)}.pdf`;
}

/** The report's revision: the variant id's first 8 characters and its version, e.g. `1a2b3c4d-v3`. */
export function variantReportRevision(variant: Pick<Variant, 'id' | 'version'>): string {
  return `${variant.id.slice(0, 8)}-v${variant.version}`;
}
