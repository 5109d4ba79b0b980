import { useQueries, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import type { Role } from '../../../shared/contracts';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { siteRecordsQueryOptions } from '../../features/site-records/api/site-records';
import { SiteRecordDetails, type RetunedVariantOptions } from '../../features/site-records/components/site-record-details';
import { UploadRecordPanel, type StructureChoice } from '../../features/site-records/components/upload-record-panel';
import { modesQueryOptions, structuresQueryOptions } from '../../features/structures/api/structures';
import { variantKeys, variantsQueryOptions } from '../../features/variants/api/variants';
import { formatPercent, formatQuantity } from '../../lib/format';
import { queryClient } from '../../lib/query-client';
import { useCurrentUser } from '../session';
import { useProjectContext } from './project-layout';

/** Who may upload a record and analyse it again: the engineers, and the fabricator who measures on site (as the API). */
const uploaderRoles: readonly Role[] = ['admin', 'engineer', 'fabricator'];

/** Prefetches the project's site records; a failure is shown by the page itself. */
export async function projectSiteRecordsLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(siteRecordsQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** Site records of the project: upload, what each record shows, and how it compares with the design. */
export function ProjectSiteRecordsRoute() {
  const { project, canEdit } = useProjectContext();
  const me = useCurrentUser();
  const canUpload = uploaderRoles.includes(me.role);
  const records = useQuery(siteRecordsQueryOptions(project.id));
  const structures = useQuery(structuresQueryOptions(project.id));
  const modes = useQueries({ queries: (structures.data ?? []).map((s) => modesQueryOptions(project.id, s.id)) });
  const [uploadedId, setUploadedId] = useState<string | null>(null);
  const [openId, setOpenId] = useState<string | null>(null);
  // Editors may make a re-tuned variant from an open record: the project's variants are read only then.
  const variants = useQuery({ ...variantsQueryOptions(project.id), enabled: canEdit && openId !== null });
  const retunedVariant: RetunedVariantOptions | undefined = canEdit
    ? {
        choices: variants.data ?? null,
        error: variants.isError ? variants.error : null,
        retry: () => void variants.refetch(),
        onCreated: () => void queryClient.invalidateQueries({ queryKey: variantKeys.all(project.id) }),
      }
    : undefined;

  const choices: StructureChoice[] = (structures.data ?? []).map((s, i) => ({
    id: s.id,
    name: s.name,
    modes: (modes[i]?.data ?? []).map((m) => ({ id: m.id, label: m.label, frequencyHz: m.frequencyHz })),
  }));
  const structureName = (id: string) => structures.data?.find((s) => s.id === id)?.name ?? 'structure';

  return (
    <div className="flex flex-col gap-6">
      {canUpload ? (
        <Panel
          title="Upload a site record"
          description="An acceleration record of the structure as built — an ambient response or a free decay after a heel drop — gives its frequency and damping ratio."
        >
          {structures.isPending ? (
            <Loading label="Loading the structures…" />
          ) : structures.isError ? (
            <QueryError error={structures.error} retry={() => void structures.refetch()} what="the structures" />
          ) : choices.length === 0 ? (
            <p className="text-small text-ink-muted">Add a structure first: a record belongs to a structure.</p>
          ) : (
            <UploadRecordPanel
              projectId={project.id}
              structures={choices}
              onUploaded={(id) => {
                setUploadedId(id);
                setOpenId(id);
              }}
            />
          )}
        </Panel>
      ) : null}
      <Panel title="Site records" description="Each record’s analysis, its plots and the comparison with the design mode it was measured for.">
        <div className="flex flex-col gap-4">
          {uploadedId ? <Notice tone="success" title="Record stored and analysed" /> : null}
          {records.isPending ? (
            <Loading label="Loading the site records…" />
          ) : records.isError ? (
            <QueryError error={records.error} retry={() => void records.refetch()} what="the site records" />
          ) : records.data.length === 0 ? (
            <p className="text-small text-ink-muted">No site records yet.</p>
          ) : (
            <ul className="flex flex-col divide-y divide-paper-line">
              {records.data.map((record) => {
                const open = openId === record.id;
                return (
                  <li key={record.id} className="flex flex-col gap-3 py-3">
                    <button
                      type="button"
                      className="flex flex-wrap items-baseline justify-between gap-2 text-left"
                      aria-expanded={open}
                      onClick={() => setOpenId(open ? null : record.id)}
                    >
                      <span className="font-semibold text-tide-800">{record.fileName}</span>
                      <span className="text-small text-ink-soft">
                        {structureName(record.structureId)} ·{' '}
                        {record.analysis.frequencyHz === null ? 'no clear mode' : formatQuantity(record.analysis.frequencyHz, 'Hz')}
                        {record.analysis.dampingRatio === null ? '' : `, ζ ${formatPercent(record.analysis.dampingRatio)}`}
                      </span>
                    </button>
                    {open ? <SiteRecordDetails projectId={project.id} record={record} canAnalyse={canUpload} canDelete={canEdit} retunedVariant={retunedVariant} /> : null}
                  </li>
                );
              })}
            </ul>
          )}
        </div>
      </Panel>
      <Caution>
        A measured damping ratio scatters from record to record: report it with its record length, and prefer several records. A re-tune is a
        starting point for the adjustment on site, checked by measuring again.
      </Caution>
    </div>
  );
}
