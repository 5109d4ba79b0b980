/**
 * The fabricator's hardware sheet of an approved sign-off, read from its snapshot only (never recomputed): the rows
 * (shared/compute/hardware-sheet.ts), the CSV and the PDF. Everyone in the organisation reads it; before approval 409.
 */
import type { Database } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import type { CurrentUser } from '../../middleware/auth';
import { buildHardwareSheet, type HardwareSheet } from '../../../shared/compute/hardware-sheet';
import { requireProjectScope } from '../structures/structures.service';
import * as repository from './sign-offs.repository';
import { fileNameSlug } from '../../lib/file-name';

export async function getHardwareSheet(db: Database, user: CurrentUser, projectId: string, signOffId: string): Promise<HardwareSheet> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSignOff(db, scope, signOffId);
  if (!row) throw notFound('The sign-off', 'sign_off_not_found');
  if (row.status !== 'approved') {
    throw new HttpError(409, 'sign_off_not_approved', `The hardware sheet exists only for an approved design; this sign-off is ${row.status}`, [
      { path: 'signOffId', message: `is ${row.status}, not approved` },
    ]);
  }
  // Everything from the approval itself: the snapshot, and the approver's and project's names kept at the decision.
  // A sign-off decided before those were kept falls back to the project's current name and names no approver.
  return buildHardwareSheet({
    projectName: row.decidedProjectName ?? (await repository.projectName(db, projectId)),
    signOff: {
      id: row.id,
      status: row.status,
      decidedAt: row.decidedAt ? row.decidedAt.toISOString() : null,
      decisionComment: row.decisionComment,
      snapshot: row.snapshot,
    },
    approver: row.decidedByEmail ? { name: row.decidedByName, email: row.decidedByEmail } : null,
  });
}

/** A file name from the project's name and the sheet's revision (letters, digits, dashes). */
export function hardwareSheetFileName(sheet: HardwareSheet, extension: 'csv' | 'pdf'): string {
  const slug = fileNameSlug(sheet.projectName, 60);
  return `${slug || 'project'}-hardware-sheet-${sheet.revision}.${extension}`;
}
