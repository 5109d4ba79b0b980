import type { Database } from '../../db/client';
import type { Executor } from '../../db/executor';
import { HttpError, invalidField, notFound } from '../../lib/http-error';
import { versionConflict } from '../../lib/versioned';
import type { CurrentUser } from '../../middleware/auth';
import type {
  AnalyseSiteRecordInput,
  RetunedVariantRequest,
  RetuneRequest,
  RetuneResponse,
  SiteRecord,
  SiteRecordComparison,
  SiteRecordTimeHistory,
  UploadSiteRecordFields,
} from '../../../shared/contracts/site-records';
import { createVariantSchema, isManualTuning, type Variant } from '../../../shared/contracts/variants';
import { EngineInputError } from '../../../shared/engine/linalg';
import { retuneDamper } from '../../../shared/engine/retune';
import { findProjectMode, findVariant } from '../variants/variants.repository';
import { createVariant } from '../variants/variants.service';
import { findMode, type ModeRow } from '../modes/modes.repository';
import { findStructure, type ProjectScope } from '../structures/structures.repository';
import { requireProjectScope } from '../structures/structures.service';
import { analyseRecord, recordTimeHistory } from './site-record-analysis';
import type { EnginePool } from '../../workers/engine-pool';
import * as repository from './site-records.repository';
import { asActor } from '../../db/actor';

const siteRecordNotFound = () => notFound('The site record', 'site_record_not_found');

const shiftPercent = (measured: number | null, design: number) => (measured === null || design === 0 ? null : ((measured - design) / design) * 100);

/** The measured numbers beside the design mode's; for a with-damper record also the damping the damper adds. */
async function compare(db: Executor, scope: ProjectScope, row: repository.SiteRecordSummaryRow): Promise<SiteRecordComparison | null> {
  if (!row.modeId) return null;
  const mode: ModeRow | undefined = await findMode(db, { ...scope, structureId: row.structureId }, row.modeId);
  if (!mode) return null;
  const measured = { frequencyHz: row.analysis.frequencyHz, dampingRatio: row.analysis.dampingRatio };
  let addedDamping: SiteRecordComparison['addedDamping'] = null;
  if (row.condition === 'with-damper' && measured.dampingRatio !== null) {
    const bare = (await repository.findWithoutDamperRecords(db, scope, mode.id)).find((record) => record.id !== row.id && record.analysis.dampingRatio !== null);
    addedDamping = bare
      ? {
          dampingRatio: measured.dampingRatio - (bare.analysis.dampingRatio as number),
          reference: 'without-damper-record',
          referenceDampingRatio: bare.analysis.dampingRatio as number,
          referenceRecordId: bare.id,
        }
      : { dampingRatio: measured.dampingRatio - mode.dampingRatio, reference: 'design-mode', referenceDampingRatio: mode.dampingRatio, referenceRecordId: null };
  }
  return {
    modeId: mode.id,
    modeLabel: mode.label,
    design: { frequencyHz: mode.frequencyHz, dampingRatio: mode.dampingRatio },
    measured,
    frequencyShiftPercent: shiftPercent(measured.frequencyHz, mode.frequencyHz),
    dampingShiftPercent: shiftPercent(measured.dampingRatio, mode.dampingRatio),
    addedDamping,
  };
}

async function toSiteRecord(db: Executor, scope: ProjectScope, row: repository.SiteRecordSummaryRow): Promise<SiteRecord> {
  return {
    id: row.id,
    projectId: row.projectId,
    structureId: row.structureId,
    modeId: row.modeId,
    condition: row.condition,
    fileName: row.fileName,
    fileSizeBytes: row.fileSizeBytes,
    channel: row.channel,
    channelIndex: row.channelIndex,
    channels: row.channels,
    sampleRateHz: row.sampleRateHz,
    sampleCount: row.sampleCount,
    measuredAt: row.measuredAt ? row.measuredAt.toISOString() : null,
    notes: row.notes,
    analysis: row.analysis,
    comparison: await compare(db, scope, row),
    version: row.version,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function readRecord(db: Executor, scope: ProjectScope, id: string): Promise<SiteRecord> {
  const row = await repository.findSiteRecord(db, scope, id);
  if (!row) throw siteRecordNotFound();
  return toSiteRecord(db, scope, row);
}

export async function listSiteRecords(db: Database, user: CurrentUser, projectId: string): Promise<SiteRecord[]> {
  const scope = await requireProjectScope(db, user, projectId);
  const rows = await repository.listSiteRecords(db, scope);
  return Promise.all(rows.map((row) => toSiteRecord(db, scope, row)));
}

export async function getSiteRecord(db: Database, user: CurrentUser, projectId: string, id: string): Promise<SiteRecord> {
  const scope = await requireProjectScope(db, user, projectId);
  return readRecord(db, scope, id);
}

export async function getSiteRecordTimeHistory(db: Database, user: CurrentUser, projectId: string, id: string): Promise<SiteRecordTimeHistory> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSiteRecordFile(db, scope, id);
  if (!row) throw siteRecordNotFound();
  return recordTimeHistory(row.fileBytes, row.channelIndex, row.givenSampleRateHz ?? undefined);
}

export interface UploadedFile {
  originalName: string;
  buffer: Buffer;
}

/** Checks the fields against the project, analyses the file, and only then stores it (a refused upload stores nothing). */
export async function uploadSiteRecord(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, fields: UploadSiteRecordFields, file: UploadedFile | undefined): Promise<SiteRecord> {
  const scope = await requireProjectScope(db, user, projectId);
  if (!file) throw invalidField('file', 'is required: a CSV with a header row, time in s, then accelerations in m/s²');
  if (!(await findStructure(db, scope, fields.structureId))) throw invalidField('structureId', 'is not a structure of this project');
  if (fields.modeId && !(await findMode(db, { ...scope, structureId: fields.structureId }, fields.modeId))) {
    throw invalidField('modeId', 'is not a mode of that structure');
  }
  const { file: read, analysis } = await analyseRecord({
    fileBytes: file.buffer,
    channel: fields.channel,
    sampleRateHz: fields.sampleRateHz,
    method: fields.method,
    bandHz: fields.bandHz as [number, number] | undefined,
  }, engine);
  const id = await asActor(db, user, (tx) => repository.insertSiteRecord(tx, scope, user.id, {
    structureId: fields.structureId,
    modeId: fields.modeId ?? null,
    condition: fields.condition,
    fileName: file.originalName.slice(0, 255) || 'record.csv',
    fileBytes: file.buffer,
    channel: read.channelName,
    channelIndex: read.channelIndex,
    channels: read.channels,
    givenSampleRateHz: fields.sampleRateHz ?? null,
    sampleRateHz: read.sampleRateHz,
    sampleCount: read.sampleCount,
    measuredAt: fields.measuredAt ? new Date(fields.measuredAt) : null,
    notes: fields.notes ?? null,
    analysis,
  }));
  return readRecord(db, scope, id);
}

/** Runs the analysis again on the stored file with another band or method and stores it (version + 1). */
export async function reanalyseSiteRecord(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string, input: AnalyseSiteRecordInput): Promise<SiteRecord> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSiteRecordFile(db, scope, id);
  if (!row) throw siteRecordNotFound();
  if (input.version !== undefined && input.version !== row.version) throw versionConflict('The site record', input.version, row.version);
  const { analysis } = await analyseRecord({
    fileBytes: row.fileBytes,
    channel: row.channelIndex,
    sampleRateHz: row.givenSampleRateHz ?? undefined,
    method: input.method,
    bandHz: input.bandHz as [number, number] | undefined,
  }, engine);
  if (!(await asActor(db, user, (tx) => repository.updateAnalysisAtVersion(tx, scope, id, input.version ?? row.version, analysis)))) {
    const now = await repository.findSiteRecord(db, scope, id);
    if (!now) throw siteRecordNotFound();
    throw versionConflict('The site record', input.version ?? row.version, now.version);
  }
  return readRecord(db, scope, id);
}

export async function deleteSiteRecord(db: Database, user: CurrentUser, projectId: string, id: string): Promise<void> {
  const scope = await requireProjectScope(db, user, projectId);
  if (!(await asActor(db, user, (tx) => repository.deleteSiteRecord(tx, scope, id)))) throw siteRecordNotFound();
}

/** The record's measured structure, refused (409) when it is not the bare structure or shows no clear mode. */
function measuredStructure(row: repository.SiteRecordSummaryRow): { frequencyHz: number; dampingRatio: number } {
  if (row.condition === 'with-damper') {
    // With the damper working the record shows the coupled system, not the structure the damper is tuned to.
    throw new HttpError(
      409,
      'not_the_bare_structure',
      'A record with the damper working shows the structure and damper together: re-tune from a record without the damper or with it locked',
    );
  }
  const { frequencyHz, dampingRatio } = row.analysis;
  if (frequencyHz === null || dampingRatio === null) {
    throw new HttpError(409, 'no_measured_mode', 'The record shows no clear mode (see its warnings): analyse it again with another band or method before re-tuning');
  }
  return { frequencyHz, dampingRatio };
}

/** The damper frequency the tuning method gives for the structure as measured, and the change to make on site. */
export async function retuneFromSiteRecord(db: Database, user: CurrentUser, projectId: string, id: string, input: RetuneRequest): Promise<RetuneResponse> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSiteRecord(db, scope, id);
  if (!row) throw siteRecordNotFound();
  const { frequencyHz, dampingRatio } = measuredStructure(row);
  try {
    const result = retuneDamper({ structureFrequencyHz: frequencyHz, structureDampingRatio: dampingRatio, ...input });
    return { siteRecordId: row.id, measured: { frequencyHz, dampingRatio }, ...result };
  } catch (error) {
    if (error instanceof EngineInputError) throw invalidField(error.field, error.message.replace(/^[^:]*:\s*/, ''));
    throw error;
  }
}

const significant = (value: number, digits = 4) => Number(value.toPrecision(digits)).toString();
const percent = (ratio: number) => `${significant(ratio * 100, 3)} %`;

/**
 * A new tuning variant from one on the record's mode: the same load cases, criteria, mass ratio, units, tolerances and
 * hardware, with the damper set by hand to what the original's method gives for the structure as measured (measured
 * f and ζ, the original's mass ratio). It is created through the variants' own create path (validated and computed
 * on the engine pool the same way). Its result is computed on the mode as stored (the design model): the as-built
 * damper checked on the design model.
 */
export async function createRetunedVariant(db: Database, engine: EnginePool, user: CurrentUser, projectId: string, id: string, input: RetunedVariantRequest): Promise<Variant> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSiteRecord(db, scope, id);
  if (!row) throw siteRecordNotFound();
  if (!row.modeId) {
    throw new HttpError(409, 'no_design_mode', 'The record names no design mode: a re-tuned variant needs a record of the mode its variant is on');
  }
  const measured = measuredStructure(row);
  const original = await findVariant(db, scope, input.variantId);
  if (!original) throw invalidField('variantId', 'is not a tuning variant of this project');
  if (original.row.modeId !== row.modeId) throw invalidField('variantId', 'is on another mode than the site record: choose a variant on the record\'s mode');
  const tuning = original.row.tuning;
  if (isManualTuning(tuning)) throw invalidField('variantId', 'is tuned by hand: it names no tuning method to re-tune by');
  const mode = await findProjectMode(db, scope, original.row.modeId);
  if (!mode) throw invalidField('variantId', 'is on a mode that is no longer in this project');

  let damper: { frequencyHz: number; dampingRatio: number };
  try {
    const retuned = retuneDamper({
      structureFrequencyHz: measured.frequencyHz,
      structureDampingRatio: measured.dampingRatio,
      massRatio: original.row.massRatio,
      method: tuning.method,
    });
    damper = { frequencyHz: retuned.targetFrequencyHz, dampingRatio: retuned.targetDampingRatio };
  } catch (error) {
    // Only the measured numbers can be out of the method's range here (the variant's own were checked when stored).
    if (error instanceof EngineInputError) {
      throw new HttpError(409, 'measured_out_of_range', `The measured structure cannot be re-tuned by ${tuning.method}: ${error.message}`);
    }
    throw error;
  }

  const shift = measured.frequencyHz / mode.frequencyHz - 1;
  const covered = Math.abs(shift) <= original.row.structureFrequencyToleranceRatio;
  const notes = [
    `Re-tuned from site record ${row.fileName} (${row.measuredAt ? `measured ${row.measuredAt.toISOString()}` : 'no measurement time given'}):`,
    `measured f = ${significant(measured.frequencyHz)} Hz, ζ = ${percent(measured.dampingRatio)}.`,
    `Damper by ${tuning.method} at μ = ${significant(original.row.massRatio)} for the measured structure: f = ${significant(damper.frequencyHz)} Hz, ζ = ${percent(damper.dampingRatio)} referred to its own frequency, set by hand;`,
    `copied from tuning variant "${original.row.name}".`,
    `The result is computed on the design mode ${mode.label} as stored (f = ${significant(mode.frequencyHz)} Hz, ζ = ${percent(mode.dampingRatio)}):`,
    `it checks the as-built damper on the design model, not on the structure as measured (frequency ${shift >= 0 ? '+' : ''}${significant(shift * 100, 3)} % from the design;`,
    covered
      ? `within the ±${significant(original.row.structureFrequencyToleranceRatio * 100, 3)} % detuning band, so the detuning check spans the measured frequency, with the design damping).`
      : `outside the ±${significant(original.row.structureFrequencyToleranceRatio * 100, 3)} % detuning band: the check does not reach the measured frequency).`,
  ].join(' ');

  // The variants' own create schema, so the new variant is checked exactly as one typed in (a bad value is 400 naming its field).
  const body = createVariantSchema.parse({
    name: input.name ?? `${original.row.name} re-tuned to ${row.fileName}`.slice(0, 120),
    modeId: original.row.modeId,
    loadCaseIds: original.loadCaseIds,
    criteriaId: original.row.criteriaId,
    massRatio: original.row.massRatio,
    tuning: damper,
    unitCount: original.row.unitCount,
    structureFrequencyToleranceRatio: original.row.structureFrequencyToleranceRatio,
    ...(original.row.tmdDampingToleranceRatio === null ? {} : { tmdDampingToleranceRatio: original.row.tmdDampingToleranceRatio }),
    hardware: original.row.hardware,
    notes,
  });
  return createVariant(db, engine, user, projectId, body);
}
