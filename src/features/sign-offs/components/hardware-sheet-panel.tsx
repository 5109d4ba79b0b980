import { useQuery } from '@tanstack/react-query';
import { formatHardwareValue } from '../../../../shared/compute/hardware-sheet';
import { Caution } from '../../../components/ui/caution';
import { Loading } from '../../../components/ui/loading';
import { Panel } from '../../../components/ui/panel';
import { QueryError } from '../../../components/ui/query-error';
import { Table, Td, Th } from '../../../components/ui/table';
import { useDisplayUnits } from '../../../lib/display-units';
import type { HardwareSheetAnswer } from '../../../../shared/contracts/sign-offs';
import { hardwareSheetPath, hardwareSheetQueryOptions } from '../api/sign-offs';
import { usCustomaryValue } from './hardware-sheet-units';

/**
 * The fabricator's hardware sheet of one approved sign-off: the same rows as its CSV and PDF (read from the approved
 * snapshot by the server: SI, lengths in mm, six significant figures), with links to both files. A person who reads
 * US customary units also gets those beside the SI values; the files stay SI.
 */
export function HardwareSheetPanel({ projectId, signOffId }: { projectId: string; signOffId: string }) {
  const sheet = useQuery(hardwareSheetQueryOptions(projectId, signOffId));
  const { system } = useDisplayUnits();
  const withUs = system === 'us-customary';
  const file = hardwareSheetPath(projectId, signOffId);
  const links = (
    <>
      <a className="text-small font-medium text-tide-800 underline underline-offset-4 hover:text-tide-900" href={`${file}.csv`} download>
        Download CSV
      </a>
      <a className="text-small font-medium text-tide-800 underline underline-offset-4 hover:text-tide-900" href={`${file}.pdf`} download>
        Download PDF
      </a>
    </>
  );
  if (sheet.isPending) return <Loading label="Loading the hardware sheet…" />;
  if (sheet.isError) return <QueryError error={sheet.error} retry={() => void sheet.refetch()} what="the hardware sheet" />;
  return (
    <Panel
      title={`Hardware sheet · ${sheet.data.variantName}`}
      description={`Revision ${sheet.data.revision}. From the approved design, never recomputed. Values in SI with lengths in mm${
        withUs ? ', and in US customary units beside them (the files stay SI)' : ''
      }.`}
      actions={links}
    >
      <Table caption={`Hardware sheet of ${sheet.data.variantName}, revision ${sheet.data.revision}`}>
        <thead>
          <tr>
            <Th>Quantity</Th>
            <Th className="text-right">Value</Th>
            <Th>Unit</Th>
            {withUs ? <Th className="text-right">US customary</Th> : null}
            <Th>Note</Th>
          </tr>
        </thead>
        {sections(sheet.data.rows).map(([section, rows]) => (
          <tbody key={section}>
            <tr>
              <th
                scope="rowgroup"
                colSpan={withUs ? 5 : 4}
                className="border-b border-paper-line px-3 pb-1.5 pt-4 text-left text-caption font-semibold uppercase tracking-[0.08em] text-ember-700"
              >
                {section}
              </th>
            </tr>
            {rows.map((row) => (
              <tr key={row.quantity} data-testid="hardware-sheet-row">
                <Td className="min-w-44">{row.quantity}</Td>
                <Td className={typeof row.value === 'number' ? 'whitespace-nowrap text-right tabular-nums' : 'min-w-32'}>{formatHardwareValue(row.value)}</Td>
                <Td className="whitespace-nowrap">{row.unit}</Td>
                {withUs ? <Td className="whitespace-nowrap text-right tabular-nums text-ink-soft">{usCustomaryValue(row.value, row.unit, 5) ?? ''}</Td> : null}
                <Td className="min-w-40 text-ink-muted">{row.note}</Td>
              </tr>
            ))}
          </tbody>
        ))}
      </Table>
      <div className="mt-4">
        {/* The sheet's own caution, word for word as its CSV and PDF carry it. */}
        <Caution wording={sheet.data.caution} />
      </div>
    </Panel>
  );
}

/** The rows grouped by their section, in the sheet's order. */
function sections(rows: HardwareSheetAnswer['rows']): [string, HardwareSheetAnswer['rows']][] {
  const groups: [string, HardwareSheetAnswer['rows']][] = [];
  for (const row of rows) {
    const last = groups.at(-1);
    if (last && last[0] === row.section) last[1].push(row);
    else groups.push([row.section, [row]]);
  }
  return groups;
}
