/**
 * The demo: an invented organisation, its people and two invented projects with their structural model and tuning
 * variants, so that a fresh install can be tried at once. Every name and place here is made up. Seeded only into an
 * empty database and never in production.
 */
import { count, eq } from 'drizzle-orm';
import { hashPassword } from '../auth/password';
import {
  createComfortCriteriaSchema,
  createLoadCaseSchema,
  createLumpedModelSchema,
  createModeSchema,
  createStructureSchema,
  type CreateComfortCriteriaInput,
  type CreateLoadCaseInput,
  type CreateLumpedModelInput,
  type CreateModeInput,
  type CreateStructureInput,
} from '../../shared/contracts/model';
import type { Role } from '../../shared/contracts/roles';
import { createVariantSchema, type VariantTuning } from '../../shared/contracts/variants';
import { deriveModeValues } from '../modules/modes/modes.service';
import type { Database } from './client';
import type { Executor } from './executor';
import {
  comfortCriteria,
  loadCases,
  lumpedModels,
  memberships,
  organisations,
  projectMembers,
  projects,
  siteRecords,
  structureModes,
  structures,
  tuningVariantLoadCases,
  tuningVariants,
  users,
} from './schema';
import { decayRecord } from '../../shared/engine/signal/test-records';
import { analyseRecord } from '../modules/site-records/site-record-analysis';

export const demoPassword = 'stillspan-demo';

export const demoOrganisationName = 'Harrowgate Lane Structures (invented demo organisation)';

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: 'admin@demo.stillspan.test', name: 'Imogen Vale', role: 'admin' },
  { email: 'engineer@demo.stillspan.test', name: 'Tomas Rennick', role: 'engineer' },
  { email: 'owner@demo.stillspan.test', name: 'Priya Halloran', role: 'owner' },
  { email: 'fabricator@demo.stillspan.test', name: 'Jonah Pell', role: 'fabricator' },
  { email: 'viewer@demo.stillspan.test', name: 'Ruth Okonjo', role: 'viewer' },
];

export const demoProjects = [
  {
    name: 'Wrenmoor Mill footbridge',
    kind: 'footbridge' as const,
    location: 'Wrenmoor, over the river Tamble (invented place)',
    description:
      'Invented demo scenario: a 46 m single-span steel box-girder footbridge between the Wrenmoor Mill flats and the ' +
      'station path. Its first vertical mode sits in the walking band and its damping is low, so a tuned mass damper ' +
      'is being sized for the owner’s comfort criteria.',
  },
  {
    name: 'Caskett Yard offices, level 3 floor',
    kind: 'floor' as const,
    location: 'Caskett Yard, Elmbridge Quay (invented place)',
    description:
      'Invented demo scenario: an open-plan office floor on long-span composite beams whose walking response the tenant ' +
      'has complained about; the study checks it against the office criteria and sizes dampers for the worst bays.',
  },
];

/**
 * The structural model of each demo project: invented structures, modes, load cases and comfort criteria (every number
 * is made up for the demo, chosen only to be plausible). A mode's `source` names a lumped model by its position in
 * `models` (`model: 0`); the seed puts in its id. The beam-derived and model-derived numbers are derived by the
 * server's own code, as if the engineer had entered the source.
 */
interface DemoModel {
  structure: CreateStructureInput;
  models: CreateLumpedModelInput[];
  modes: (Omit<CreateModeInput, 'source'> & { source?: CreateModeInput['source'] | { kind: 'lumped-model'; model: number; modeNumber: number; dofIndex: number } })[];
  loadCases: CreateLoadCaseInput[];
  comfortCriteria: CreateComfortCriteriaInput[];
  /** Tuning variants naming their mode by label, load cases and criteria by name. */
  variants: DemoVariant[];
}

interface DemoVariant {
  name: string;
  mode: string;
  loadCases: string[];
  criteria: string;
  massRatio: number;
  tuning: VariantTuning;
  unitCount: number;
  notes: string;
}

const demoVariantNote = 'Invented demo variant: a starting point for the study, not a design; its result is computed when it is first read.';

// Invented footbridge girder: 46 m simply supported, EI 1.18e10 N m², 1800 kg/m (about 1.9 Hz, modal mass about 41 t).
const footbridgeBeam = { lengthM: 46, bendingStiffnessNM2: 1.18e10, massPerLengthKgPerM: 1800 };
const footbridgeDeckAreaM2 = 46 * 3.2;

export const demoStructuralModels: Record<(typeof demoProjects)[number]['kind'], DemoModel> = {
  footbridge: {
    structure: {
      name: 'Main span',
      kind: 'footbridge-span',
      spanM: 46,
      widthM: 3.2,
      deckAreaM2: footbridgeDeckAreaM2,
      notes: 'Invented demo structure: single-span steel box girder on elastomeric bearings.',
    },
    models: [
      {
        // The invented girder lumped at its quarter points (mass mL/4 each; stiffness from the beam's flexibility there).
        name: 'Girder lumped at quarter points (invented)',
        massMatrixKg: [
          [20_700, 0, 0],
          [0, 20_700, 0],
          [0, 0, 20_700],
        ],
        stiffnessMatrixNPerM: [
          [7.648e7, -7.315e7, 2.993e7],
          [-7.315e7, 1.064e8, -7.315e7],
          [2.993e7, -7.315e7, 7.648e7],
        ],
        dofLabels: ['quarter span', 'midspan', 'three-quarter span'],
      },
    ],
    modes: [
      {
        label: 'First vertical (FE model, invented)',
        direction: 'vertical',
        frequencyHz: 1.87,
        modalMassKg: 42_500,
        dampingRatio: 0.005,
        modeShapeMean: 0.63,
      },
      {
        label: 'First lateral (FE model, invented)',
        direction: 'lateral',
        frequencyHz: 0.92,
        modalMassKg: 44_000,
        dampingRatio: 0.006,
        modeShapeMean: 0.63,
      },
      {
        label: 'First vertical (beam estimate)',
        direction: 'vertical',
        dampingRatio: 0.005,
        source: { kind: 'beam', support: 'simply-supported', ...footbridgeBeam },
      },
      {
        label: 'First vertical (lumped model, damper at midspan)',
        direction: 'vertical',
        dampingRatio: 0.005,
        source: { kind: 'lumped-model', model: 0, modeNumber: 1, dofIndex: 1 },
      },
    ],
    loadCases: [
      { name: 'Crowd, Sétra class II', spec: { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: footbridgeDeckAreaM2 } },
      { name: 'Single walker', spec: { kind: 'walker' } },
      { name: 'Lateral crowd, HiVoSS TC3', spec: { kind: 'lateral', guide: 'hivoss', trafficClass: 'TC3', deckAreaM2: footbridgeDeckAreaM2 } },
    ],
    comfortCriteria: [{ name: 'Sétra mean comfort', spec: { set: 'setra', class: 'mean' } }],
    variants: [
      {
        name: 'Den Hartog 2 % (invented demo variant)',
        mode: 'First vertical (FE model, invented)',
        loadCases: ['Crowd, Sétra class II', 'Single walker'],
        criteria: 'Sétra mean comfort',
        massRatio: 0.02,
        tuning: { method: 'den-hartog' },
        unitCount: 2,
        notes: demoVariantNote,
      },
      {
        name: 'H∞ 3 % (invented demo variant)',
        mode: 'First vertical (FE model, invented)',
        loadCases: ['Crowd, Sétra class II', 'Single walker'],
        criteria: 'Sétra mean comfort',
        massRatio: 0.03,
        tuning: { method: 'hinf' },
        unitCount: 2,
        notes: demoVariantNote,
      },
    ],
  },
  floor: {
    structure: {
      name: 'Bay C4',
      kind: 'floor-bay',
      spanM: 13.5,
      widthM: 9,
      deckAreaM2: 121.5,
      notes: 'Invented demo structure: composite slab on long-span secondary beams at 3 m centres.',
    },
    models: [],
    modes: [
      {
        label: 'First vertical (FE model, invented)',
        direction: 'vertical',
        frequencyHz: 5.6,
        modalMassKg: 28_000,
        dampingRatio: 0.03,
      },
      {
        label: 'Secondary beam (beam estimate)',
        direction: 'vertical',
        dampingRatio: 0.03,
        source: { kind: 'beam', support: 'simply-supported', lengthM: 13.5, bendingStiffnessNM2: 4.4e8, massPerLengthKgPerM: 1050 },
      },
    ],
    loadCases: [{ name: 'Floor walking (DG11)', spec: { kind: 'floor-walking' } }],
    comfortCriteria: [{ name: 'DG11 office', spec: { set: 'dg11', class: 'office' } }],
    variants: [
      {
        name: 'Den Hartog 2 % (invented demo variant)',
        mode: 'First vertical (FE model, invented)',
        loadCases: ['Floor walking (DG11)'],
        criteria: 'DG11 office',
        massRatio: 0.02,
        tuning: { method: 'den-hartog' },
        unitCount: 4,
        notes: demoVariantNote,
      },
      {
        name: 'H∞ 3 % (invented demo variant)',
        mode: 'First vertical (FE model, invented)',
        loadCases: ['Floor walking (DG11)'],
        criteria: 'DG11 office',
        massRatio: 0.03,
        tuning: { method: 'hinf' },
        unitCount: 4,
        notes: demoVariantNote,
      },
    ],
  },
};

/** Seeds one project's structural model through the same contract checks and derivations as the API. */
async function seedStructuralModel(tx: Executor, organisationId: string, projectId: string, createdBy: string, demo: DemoModel): Promise<SeededModel> {
  const [structure] = await tx
    .insert(structures)
    .values({ ...createStructureSchema.parse(demo.structure), projectId, createdBy })
    .returning();
  const scope = { organisationId, projectId, structureId: structure.id };
  const modelIds: string[] = [];
  for (const model of demo.models) {
    const input = createLumpedModelSchema.parse(model);
    const [row] = await tx
      .insert(lumpedModels)
      .values({ ...input, dofLabels: input.dofLabels ?? null, structureId: structure.id, createdBy })
      .returning();
    modelIds.push(row.id);
  }
  const orderedModeIds: string[] = [];
  for (const mode of demo.modes) {
    let source: CreateModeInput['source'];
    if (mode.source && 'model' in mode.source) {
      const { model, ...rest } = mode.source;
      source = { ...rest, modelId: modelIds[model] };
    } else {
      source = mode.source;
    }
    const input = createModeSchema.parse({ ...mode, source });
    const derived = await deriveModeValues(tx, scope, input.source);
    const [modeRow] = await tx.insert(structureModes).values({
      structureId: structure.id,
      createdBy,
      label: input.label,
      direction: input.direction,
      frequencyHz: derived?.frequencyHz ?? input.frequencyHz!,
      modalMassKg: derived?.modalMassKg ?? input.modalMassKg!,
      dampingRatio: input.dampingRatio,
      modeShapeMean: derived?.modeShapeMean ?? input.modeShapeMean ?? null,
      source: input.source,
      lumpedModelId: derived?.lumpedModelId ?? null,
    }).returning({ id: structureModes.id });
    orderedModeIds.push(modeRow.id);
  }
  const modeIds = new Map<string, string>();
  for (const row of await tx.select({ id: structureModes.id, label: structureModes.label }).from(structureModes).where(eq(structureModes.structureId, structure.id))) {
    modeIds.set(row.label, row.id);
  }
  const loadCaseIds = new Map<string, string>();
  for (const loadCase of demo.loadCases) {
    const [row] = await tx.insert(loadCases).values({ ...createLoadCaseSchema.parse(loadCase), projectId, createdBy }).returning({ id: loadCases.id });
    loadCaseIds.set(loadCase.name, row.id);
  }
  const criteriaIds = new Map<string, string>();
  for (const criteria of demo.comfortCriteria) {
    const [row] = await tx.insert(comfortCriteria).values({ ...createComfortCriteriaSchema.parse(criteria), projectId, createdBy }).returning({ id: comfortCriteria.id });
    criteriaIds.set(criteria.name, row.id);
  }
  // Tuning variants: stored without a result, which the first read computes (docs/decisions/0012-tuning-variants.md).
  for (const variant of demo.variants) {
    const input = createVariantSchema.parse({
      name: variant.name,
      modeId: modeIds.get(variant.mode),
      loadCaseIds: variant.loadCases.map((name) => loadCaseIds.get(name)),
      criteriaId: criteriaIds.get(variant.criteria),
      massRatio: variant.massRatio,
      tuning: variant.tuning,
      unitCount: variant.unitCount,
      notes: variant.notes,
    });
    const { loadCaseIds: ids, ...values } = input;
    const [row] = await tx
      .insert(tuningVariants)
      .values({ ...values, tmdDampingToleranceRatio: values.tmdDampingToleranceRatio ?? null, notes: values.notes ?? null, projectId, createdBy })
      .returning({ id: tuningVariants.id });
    await tx.insert(tuningVariantLoadCases).values(ids.map((loadCaseId, position) => ({ variantId: row.id, position, loadCaseId })));
  }
  return { structureId: structure.id, modeIds: orderedModeIds };
}

interface SeededModel {
  structureId: string;
  /** In the order of the demo's modes. */
  modeIds: string[];
}

/**
 * Invented site records of the demo footbridge's first vertical mode: free decays after a heel drop, made by the
 * seed from a single-DOF oscillator with a little noise (seeded, so every install gets the same files), one before
 * and one after the damper was installed. The numbers are invented for the demo; no bridge was measured.
 */
export const demoSiteRecords = [
  {
    condition: 'without-damper' as const,
    oscillator: { frequencyHz: 1.93, dampingRatio: 0.007 },
    seed: 4101,
    fileName: 'wrenmoor-heel-drop-before-damper.csv',
    measuredAt: '2026-03-10T07:40:00Z',
    notes: 'Invented demo record (not a measurement): heel drop at midspan before the damper was fitted, made by the seed from a 1.93 Hz, 0.7 % oscillator with noise.',
  },
  {
    condition: 'with-damper' as const,
    oscillator: { frequencyHz: 1.91, dampingRatio: 0.034 },
    seed: 4102,
    fileName: 'wrenmoor-heel-drop-with-damper.csv',
    measuredAt: '2026-04-21T07:15:00Z',
    notes: 'Invented demo record (not a measurement): heel drop at midspan with the damper working, made by the seed from a 1.91 Hz, 3.4 % oscillator with noise.',
  },
];

/** A demo record as a CSV file: time in s, midspan and quarter-span acceleration in m/s² (the quarter point at 0.7 of midspan). */
export function demoSiteRecordCsv(record: (typeof demoSiteRecords)[number]): string {
  const sampleRateHz = 100;
  const samples = decayRecord({ ...record.oscillator, sampleRateHz }, 60, record.seed, { initialVelocityMPerS: 0.004, noiseStd: 0.0008, quietS: 3 });
  const lines = ['time_s,midspan_mps2,quarter_span_mps2'];
  for (let i = 0; i < samples.length; i++) lines.push(`${(i / sampleRateHz).toFixed(2)},${samples[i].toFixed(6)},${(0.7 * samples[i]).toFixed(6)}`);
  return `${lines.join('\n')}\n`;
}

async function seedSiteRecords(tx: Executor, projectId: string, createdBy: string, model: SeededModel): Promise<void> {
  for (const record of demoSiteRecords) {
    const fileBytes = Buffer.from(demoSiteRecordCsv(record), 'utf8');
    const { file, analysis } = await analyseRecord({ fileBytes });
    await tx.insert(siteRecords).values({
      projectId,
      structureId: model.structureId,
      modeId: model.modeIds[0],
      condition: record.condition,
      fileName: record.fileName,
      fileBytes,
      channel: file.channelName,
      channelIndex: file.channelIndex,
      channels: file.channels,
      givenSampleRateHz: null,
      sampleRateHz: file.sampleRateHz,
      sampleCount: file.sampleCount,
      measuredAt: new Date(record.measuredAt),
      notes: record.notes,
      analysis,
      createdBy,
    });
  }
}

/** True when the database holds no organisation yet. */
export async function databaseIsEmpty(db: Database): Promise<boolean> {
  const [row] = await db.select({ n: count() }).from(organisations);
  return row.n === 0;
}

/** Seeds the demo into an empty database; does nothing (and returns false) when any organisation exists. */
export async function seedDemoIfEmpty(db: Database): Promise<boolean> {
  if (!(await databaseIsEmpty(db))) return false;
  // Every demo account has the same published password: one hash serves them all.
  const passwordHash = await hashPassword(demoPassword);
  await db.transaction(async (tx) => {
    const [organisation] = await tx.insert(organisations).values({ name: demoOrganisationName }).returning();
    const people = await tx
      .insert(users)
      .values(demoAccounts.map((account) => ({ email: account.email, name: account.name, passwordHash, emailVerified: new Date() })))
      .returning({ id: users.id, email: users.email });
    const idByEmail = new Map(people.map((person) => [person.email, person.id]));
    await tx.insert(memberships).values(demoAccounts.map((account) => ({ organisationId: organisation.id, userId: idByEmail.get(account.email)!, role: account.role })));
    const engineerId = idByEmail.get('engineer@demo.stillspan.test')!;
    const rows = await tx
      .insert(projects)
      .values(demoProjects.map((project) => ({ ...project, organisationId: organisation.id, createdBy: engineerId })))
      .returning({ id: projects.id, kind: projects.kind });
    for (const project of rows) {
      const model = await seedStructuralModel(tx, organisation.id, project.id, engineerId, demoStructuralModels[project.kind]);
      if (project.kind === 'footbridge') await seedSiteRecords(tx, project.id, idByEmail.get('fabricator@demo.stillspan.test')!, model);
    }
    const team = ['engineer@demo.stillspan.test', 'owner@demo.stillspan.test', 'fabricator@demo.stillspan.test'].map((email) => idByEmail.get(email)!);
    await tx.insert(projectMembers).values(rows.flatMap((project) => team.map((userId) => ({ projectId: project.id, userId }))));
  });
  return true;
}
