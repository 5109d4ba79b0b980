import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { LinkButton } from '../../components/ui/button';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/loading';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import {
  loadCasesQueryOptions,
  prefetchVariantModel,
  projectModesQueryOptions,
  variantsQueryOptions,
} from '../../features/variants/api/variants';
import { VariantComparison } from '../../features/variants/components/variant-comparison';
import { VariantList } from '../../features/variants/components/variant-list';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

export async function tuningVariantsLoader({ params }: LoaderFunctionArgs) {
  await prefetchVariantModel(queryClient, params.projectId ?? '');
  return null;
}

/** The project's tuning variants, and the ones ticked side by side. */
export function TuningVariantsRoute() {
  const { project, canEdit } = useProjectContext();
  const client = useQueryClient();
  const variants = useQuery(variantsQueryOptions(project.id));
  const modes = useQuery(projectModesQueryOptions(project.id, client));
  const loadCases = useQuery(loadCasesQueryOptions(project.id));
  const [search, setSearch] = useSearchParams();
  // The ticks live in the page's state, which changes at once; the address follows them (so a comparison can be
  // shared), but is never read back mid-navigation, where a second quick tick would undo the first.
  const [selected, setSelected] = useState<string[]>(() => (search.get('compare') ?? '').split(',').filter(Boolean));
  const compareParam = selected.join(',');
  useEffect(() => {
    if ((search.get('compare') ?? '') !== compareParam) setSearch(compareParam ? { compare: compareParam } : {}, { replace: true });
  }, [compareParam, search, setSearch]);

  const toggle = (id: string) => {
    setSelected((now) => (now.includes(id) ? now.filter((s) => s !== id) : [...now, id]));
  };

  if (variants.isPending || modes.isPending || loadCases.isPending) return <Loading label="Loading the tuning variants…" />;
  if (variants.isError) return <QueryError error={variants.error} retry={() => void variants.refetch()} what="the tuning variants" />;
  if (modes.isError) return <QueryError error={modes.error} retry={() => void modes.refetch()} what="the modes" />;
  if (loadCases.isError) return <QueryError error={loadCases.error} retry={() => void loadCases.refetch()} what="the load cases" />;

  const compared = selected.map((id) => variants.data.find((v) => v.id === id)).filter((v) => v !== undefined);
  return (
    <div className="flex flex-col gap-6">
      <Panel
        title="Tuning variants"
        description="Each variant is a damper on one mode — its mass ratio and tuning — checked under load cases against comfort criteria. Tick two or more to compare them."
        actions={
          canEdit ? (
            <LinkButton to={`/projects/${project.id}/tuning-variants/new`}>New variant</LinkButton>
          ) : undefined
        }
      >
        {variants.data.length === 0 ? (
          <p className="text-small text-ink-muted">No tuning variants yet.{canEdit ? ' Create one to size a damper for a mode.' : ''}</p>
        ) : (
          <VariantList projectId={project.id} variants={variants.data} modes={modes.data} selected={selected} onToggle={toggle} />
        )}
      </Panel>
      {compared.length >= 2 ? (
        <Panel title="Side by side" description="The least value of each row is tagged; verdicts per load case below.">
          <VariantComparison projectId={project.id} variants={compared} loadCases={loadCases.data} />
        </Panel>
      ) : compared.length === 1 ? (
        <p className="text-small text-ink-muted">Tick one more variant to compare.</p>
      ) : null}
      <Caution />
    </div>
  );
}
