import { useQuery } from '@tanstack/react-query';
import { formatHardwareValue } from '../../../../shared/compute/hardware-sheet';
import { Loading } from '../../../components/ui/loading';
import { Panel } from '../../../components/ui/panel';
import { QueryError } from '../../../components/ui/query-error';
import { Table, Td, Th } from '../../../components/ui/table';
import { hardwareSheetPath, hardwareSheetQueryOptions } from '../api/sign-offs';

/**
 * The fabricator's hardware sheet of one approved sign-off: the same rows as its CSV and PDF (read from the approved
 * snapshot by the server), with links to both files.
 */
export function HardwareSheetPanel({ projectId, signOffId }: { projectId: string; signOffId: string }) {
  const sheet = useQuery(hardwareSheetQueryOptions(projectId, signOffId));
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
      description={`Revision ${sheet.data.revision}. From the approved design, never recomputed.`}
      actions={links}
    >
      <Table caption={`Hardware sheet of ${sheet.data.variantName}, revision ${sheet.data.revision}`}>
        <thead>
          <tr>
            <Th>Section</Th>
            <Th>Quantity</Th>
            <Th className="text-right">Value</Th>
            <Th>Unit</Th>
            <Th>Note</Th>
          </tr>
        </thead>
        <tbody>
          {sheet.data.rows.map((row) => (
            <tr key={`${row.section}-${row.quantity}`}>
              <Td className="text-ink-muted">{row.section}</Td>
              <Td className="min-w-48">{row.quantity}</Td>
              <Td className="whitespace-nowrap text-right tabular-nums">{formatHardwareValue(row.value)}</Td>
              <Td>{row.unit}</Td>
              <Td className="text-ink-muted">{row.note}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <p className="mt-4 text-small text-ink-soft" role="note">
        {sheet.data.caution}
      </p>
    </Panel>
  );
}
