/**
 * The demo: an invented organisation, its people and two invented projects, so that a fresh install can be tried
 * at once. Every name and place here is made up. Seeded only into an empty database and never in production.
 */
import { count } from 'drizzle-orm';
import { hashPassword } from '../auth/password';
import type { Role } from '../../shared/contracts/roles';
import type { Database } from './client';
import { memberships, organisations, projectMembers, projects, users } from './schema';

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
      .returning({ id: projects.id });
    const team = ['engineer@demo.stillspan.test', 'owner@demo.stillspan.test', 'fabricator@demo.stillspan.test'].map((email) => idByEmail.get(email)!);
    await tx.insert(projectMembers).values(rows.flatMap((project) => team.map((userId) => ({ projectId: project.id, userId }))));
  });
  return true;
}
