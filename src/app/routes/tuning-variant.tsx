import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { Panel } from '../../components/ui/panel';
import { PageTitle } from '../../components/ui/page-title';
import { QueryError } from '../../components/ui/query-error';
import {
  comfortCriteriaQueryOptions,
  loadCasesQueryOptions,
  prefetchVariantModel,
  projectModesQueryOptions,
  useDeleteVariant,
  variantQueryOptions,
} from '../../features/variants/api/variants';
import { SubmitSignOff } from '../../features/sign-offs/components/submit-sign-off';
import { VariantDetails } from '../../features/variants/components/variant-details';
import { VariantEditor } from '../../features/variants/components/variant-editor';
import { describeError } from '../../lib/api-client';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

export async function tuningVariantLoader({ params }: LoaderFunctionArgs) {
  const projectId = params.projectId ?? '';
  await Promise.all([
    prefetchVariantModel(queryClient, projectId),
    params.variantId ? queryClient.ensureQueryData(variantQueryOptions(projectId, params.variantId)) : null,
  ]);
  return null;
}

function BackLink({ projectId }: { projectId: string }) {
  return (
    <Link to={`/projects/${projectId}/tuning-variants`} className="text-small font-medium text-tide-800 underline-offset-4 hover:underline">
      ← All tuning variants
    </Link>
  );
}

function useModel(projectId: string) {
  const client = useQueryClient();
  const modes = useQuery(projectModesQueryOptions(projectId, client));
  const loadCases = useQuery(loadCasesQueryOptions(projectId));
  const criteria = useQuery(comfortCriteriaQueryOptions(projectId));
  return { modes, loadCases, criteria };
}

/** One stored variant, read in full. */
export function TuningVariantRoute() {
  const { project, canEdit } = useProjectContext();
  const { variantId = '' } = useParams();
  const navigate = useNavigate();
  const variant = useQuery(variantQueryOptions(project.id, variantId));
  const { modes, criteria } = useModel(project.id);
  const remove = useDeleteVariant(project.id, variantId);
  const [confirming, setConfirming] = useState(false);

  if (variant.isPending || modes.isPending || criteria.isPending) return <Loading label="Loading the variant…" />;
  if (variant.isError) return <QueryError error={variant.error} retry={() => void variant.refetch()} what="the variant" />;
  if (modes.isError || criteria.isError) return <QueryError error={modes.error ?? criteria.error} what="the structural model" />;
  return (
    <div className="flex flex-col gap-4">
      <PageTitle title={`${variant.data.name} · ${project.name}`} />
      <BackLink projectId={project.id} />
      {confirming ? (
        <Notice
          tone="caution"
          title={`Delete ${variant.data.name}?`}
          action={
            <div className="flex gap-2">
              <Button tone="danger" busy={remove.isPending} onClick={() => remove.mutate(undefined, { onSuccess: () => navigate(`/projects/${project.id}/tuning-variants`) })}>
                Delete
              </Button>
              <Button tone="quiet" onClick={() => setConfirming(false)}>
                Keep it
              </Button>
            </div>
          }
        >
          The variant and its result are removed; the structural model is not touched.
          {remove.isError ? <p className="mt-1 text-signal-error">{describeError(remove.error)}</p> : null}
        </Notice>
      ) : null}
      <VariantDetails
        projectId={project.id}
        variant={variant.data}
        mode={modes.data.find((m) => m.mode.id === variant.data.modeId)}
        criteria={criteria.data.find((c) => c.id === variant.data.criteriaId)}
        canEdit={canEdit}
        onDelete={() => setConfirming(true)}
        deleting={remove.isPending}
      />
      {canEdit ? (
        <Panel title="Sign-off" description="Ask the owner to approve the comfort criteria and this design.">
          <SubmitSignOff key={variant.data.id} projectId={project.id} variantId={variant.data.id} />
        </Panel>
      ) : null}
    </div>
  );
}

/** The editor: a new variant, or a stored one (`:variantId/edit`). Readers are sent to the variant's page. */
export function TuningVariantEditRoute() {
  const { project, canEdit } = useProjectContext();
  const { variantId } = useParams();
  const navigate = useNavigate();
  const variant = useQuery({ ...variantQueryOptions(project.id, variantId ?? ''), enabled: Boolean(variantId) });
  const { modes, loadCases, criteria } = useModel(project.id);

  if (!canEdit) {
    return (
      <Notice tone="info" title="Reading only">
        Your role reads tuning variants; an engineer changes them. <BackLink projectId={project.id} />
      </Notice>
    );
  }
  if ((variantId && variant.isPending) || modes.isPending || loadCases.isPending || criteria.isPending) return <Loading label="Loading the editor…" />;
  if (variantId && variant.isError) return <QueryError error={variant.error} what="the variant" />;
  if (modes.isError || loadCases.isError || criteria.isError) return <QueryError error={modes.error ?? loadCases.error ?? criteria.error} what="the structural model" />;
  return (
    <div className="flex flex-col gap-4">
      <PageTitle title={`${variant.data ? `Edit ${variant.data.name}` : 'New tuning variant'} · ${project.name}`} />
      <BackLink projectId={project.id} />
      <h2 className="text-headline font-semibold text-ink">{variant.data ? `Edit ${variant.data.name}` : 'New tuning variant'}</h2>
      <VariantEditor
        key={variant.data?.id ?? 'new'}
        projectId={project.id}
        variant={variant.data}
        modes={modes.data}
        loadCases={loadCases.data}
        comfortCriteria={criteria.data}
        onSaved={(saved) => navigate(`/projects/${project.id}/tuning-variants/${saved.id}`)}
        onCancel={() => navigate(variantId ? `/projects/${project.id}/tuning-variants/${variantId}` : `/projects/${project.id}/tuning-variants`)}
      />
    </div>
  );
}
