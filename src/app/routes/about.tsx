import { roles } from '../../../shared/contracts';
import { engineeringCaution } from '../../components/layouts/site-footer';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { Table, Td, Th } from '../../components/ui/table';
import { describeRole, formatRole } from '../../lib/format';
import { PageTitle } from '../../components/ui/page-title';

export function AboutRoute() {
  return (
    <div className="flex flex-col gap-8">
      <PageTitle title="About" />
      <PageHeader
        eyebrow="About"
        title="Stillspan"
        lead="Tuned mass damper design for footbridges and long-span floors that people make lively by walking, running and crowding on them."
      />
      <Panel title="What it is for">
        <div className="flex max-w-prose flex-col gap-3 text-body text-ink-soft">
          <p>
            When a structure&apos;s vertical or lateral mode lies in the pacing-frequency range and its own damping is low, a
            tuned mass damper is the usual cure. In Stillspan the engineer models the mode, sizes the damper&apos;s mass ratio
            and tuning, checks comfort limits under pedestrian load cases and compares tuning variants; the owner approves
            the comfort criteria and the chosen design; the fabricator reads the spring, damper and stroke specification;
            after installation the team checks the as-built structure against site measurements.
          </p>
          <p>
            This release holds the organisation, its people and roles, and its projects with their structural model:
            structures and their modes (typed in, derived from a beam or taken from a lumped n-DOF model whose modes and
            free vibration are computed as you type), load cases and comfort criteria, tuning variants, the owner's
            sign-off, the fabricator's hardware sheet of an approved design (CSV and PDF) with the as-built record of each
            damper unit, the engineer's design report of a tuning variant (PDF), site records, and the project's history
            of every change.
          </p>
        </div>
      </Panel>
      <section aria-labelledby="caution-title" className="rounded-plate border-l-4 border-ember-500 bg-ember-50 px-6 py-5">
        <h2 id="caution-title" className="text-lead font-semibold text-ember-700">
          Caution
        </h2>
        <p className="mt-2 max-w-prose text-body text-ink">{engineeringCaution}</p>
      </section>
      <Panel title="Roles">
        <Table caption="Roles and what they do">
          <thead>
            <tr>
              <Th>Role</Th>
              <Th>Does</Th>
            </tr>
          </thead>
          <tbody>
            {roles.map((role) => (
              <tr key={role}>
                <Td className="font-semibold">{formatRole(role)}</Td>
                <Td className="text-ink-soft">{describeRole(role)}</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
    </div>
  );
}
