import type { UseQueryResult } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { Button } from '../ui/button';
import { Caution } from '../ui/caution';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Panel } from '../ui/panel';
import { QueryError } from '../ui/query-error';

export interface CollectionPageProps<T> {
  /** The query of the listed things. */
  query: UseQueryResult<T[]>;
  canEdit: boolean;
  /** The list panel's title and description. */
  title: string;
  description: string;
  /** The things in the plural, lower case (“load cases”): for the loading, error and empty texts. */
  plural: string;
  /** The create button's label and the create panel's title (“New load case”). */
  newLabel: string;
  newDescription: string;
  /** The notice after one was created (“Load case added”). */
  addedTitle: string;
  /** Extra words in the page's caution, if any. */
  caution?: ReactNode;
  renderList: (items: T[]) => ReactNode;
  renderCreateForm: (onCreated: () => void) => ReactNode;
}

/** A project page with a list of things, and a panel to create one that opens from the list's button. */
export function CollectionPage<T>({
  query,
  canEdit,
  title,
  description,
  plural,
  newLabel,
  newDescription,
  addedTitle,
  caution,
  renderList,
  renderCreateForm,
}: CollectionPageProps<T>) {
  const [creating, setCreating] = useState(false);
  const [added, setAdded] = useState(false);
  return (
    <div className="flex flex-col gap-6">
      <Panel
        title={title}
        description={description}
        actions={
          canEdit && !creating ? (
            <Button
              onClick={() => {
                setAdded(false);
                setCreating(true);
              }}
            >
              {newLabel}
            </Button>
          ) : undefined
        }
      >
        <div className="flex flex-col gap-4">
          {added ? <Notice tone="success" title={addedTitle} /> : null}
          {query.isPending ? (
            <Loading label={`Loading the ${plural}…`} />
          ) : query.isError ? (
            <QueryError error={query.error} retry={() => void query.refetch()} what={`the ${plural}`} />
          ) : query.data.length === 0 ? (
            <p className="text-small text-ink-muted">{`No ${plural} yet.`}</p>
          ) : (
            renderList(query.data)
          )}
        </div>
      </Panel>
      {creating ? (
        <Panel title={newLabel} description={newDescription}>
          <div className="flex flex-col gap-4">
            {renderCreateForm(() => {
              setCreating(false);
              setAdded(true);
            })}
            <div>
              <Button tone="quiet" onClick={() => setCreating(false)}>
                Cancel
              </Button>
            </div>
          </div>
        </Panel>
      ) : null}
      <Caution>{caution}</Caution>
    </div>
  );
}
