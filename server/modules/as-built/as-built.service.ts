/**
 * As-built records of an approved damper: the fabricator (or an engineer or admin) records what each unit measured;
 * every record is kept and answered with its comparison against the hardware sheet of the approved snapshot
 * (shared/compute/as-built.ts, docs/decisions/0021-as-built-records.md).
 */
import type { Database } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import { asActor } from '../../db/actor';
import type { CurrentUser } from '../../middleware/auth';
import { asBuiltInputSchemaFor, type AsBuiltInput, type AsBuiltRecord, type AsBuiltUnit } from '../../../shared/contracts/as-built';
import { asBuiltDesignOf, AsBuiltDesignUnavailableError, compareAsBuilt, type AsBuiltDesign } from '../../../shared/compute/as-built';
import { requireProjectScope } from '../structures/structures.service';
import type { ProjectScope } from '../structures/structures.repository';
import { findSignOff } from '../sign-offs/sign-offs.repository';
import * as repository from './as-built.repository';

/** The approved sign-off's design numbers: 404 when it is not the project's (or the organisation's), 409 before approval. */
async function approvedDesign(db: Database, user: CurrentUser, projectId: string, signOffId: string): Promise<{ scope: ProjectScope; design: AsBuiltDesign }> {
  const scope = await requireProjectScope(db, user, projectId);
  const signOff = await findSignOff(db, scope, signOffId);
  if (!signOff) throw notFound('The sign-off', 'sign_off_not_found');
  if (signOff.status !== 'approved') {
    throw new HttpError(409, 'sign_off_not_approved', `As-built records belong to an approved design; this sign-off is ${signOff.status}`, [
      { path: 'signOffId', message: `is ${signOff.status}, not approved` },
    ]);
  }
  try {
    return { scope, design: asBuiltDesignOf(signOff.snapshot) };
  } catch (error) {
    if (!(error instanceof AsBuiltDesignUnavailableError)) throw error;
    throw new HttpError(409, 'hardware_sheet_unavailable', `There is no hardware sheet to compare with: ${error.message}`, [
      { path: 'signOffId', message: error.message },
    ]);
  }
}

function toRecord(row: Omit<repository.AsBuiltRow, 'recordedByName'> & { recordedByName?: string | null }, design: AsBuiltDesign): AsBuiltRecord {
  return {
    id: row.id,
    projectId: row.projectId,
    signOffId: row.signOffId,
    units: row.units,
    note: row.note,
    recordedBy: row.recordedBy,
    recordedByName: row.recordedByName ?? null,
    recordedAt: row.recordedAt.toISOString(),
    comparison: compareAsBuilt(design, row.units),
  };
}

export async function listAsBuilt(db: Database, user: CurrentUser, projectId: string, signOffId: string): Promise<AsBuiltRecord[]> {
  const { scope, design } = await approvedDesign(db, user, projectId, signOffId);
  return (await repository.listRecords(db, scope, signOffId)).map((row) => toRecord(row, design));
}

/** Appends a record (earlier ones stay); unit numbers beyond the sheet's unit count are 400 naming the field. */
export async function recordAsBuilt(db: Database, user: CurrentUser, projectId: string, signOffId: string, input: AsBuiltInput): Promise<AsBuiltRecord> {
  const { scope, design } = await approvedDesign(db, user, projectId, signOffId);
  const checked = asBuiltInputSchemaFor(design.unitCount).parse(input);
  const units: AsBuiltUnit[] = checked.units.map((unit) => ({
    unitNumber: unit.unitNumber,
    movingMassKg: unit.movingMassKg,
    ...(unit.springRateNPerM !== undefined ? { springRateNPerM: unit.springRateNPerM } : {}),
    ...(unit.frequencyHz !== undefined ? { frequencyHz: unit.frequencyHz } : {}),
    ...(unit.measuredAt !== undefined ? { measuredAt: unit.measuredAt } : {}),
    ...(unit.note ? { note: unit.note } : {}),
  }));
  const row = await asActor(db, user, (tx) => repository.insertRecord(tx, scope, { signOffId, units, note: checked.note ? checked.note : null, recordedBy: user.id }));
  return toRecord({ ...row, recordedByName: user.name || user.email }, design);
}
