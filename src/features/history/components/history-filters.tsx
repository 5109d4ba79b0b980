import { useState, type FormEvent } from 'react';
import { historyActions, historyEntities, type HistoryFilters } from '../../../../shared/contracts/history';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { actionVerbs, entityNoun } from './describe-event';

export interface PersonChoice {
  id: string;
  name: string;
}

/** A day picked in the person's own time zone as the instant it starts ("2026-03-01" → local midnight, in UTC). */
function dayStart(day: string, plusDays = 0): string | undefined {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!match) return undefined;
  return new Date(Number(match[1]), Number(match[2]) - 1, Number(match[3]) + plusDays).toISOString();
}

/** The local day of an instant, for the date field ("2026-03-01"). */
function dayOf(iso: string | undefined, minusDays = 0): string {
  if (!iso) return '';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  date.setDate(date.getDate() - minusDays);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

interface HistoryFiltersFormProps {
  filters: HistoryFilters;
  people: readonly PersonChoice[];
  onChange: (filters: HistoryFilters) => void;
}

/** What kind of thing, what happened, who, and from which day to which day (both days included). */
export function HistoryFiltersForm({ filters, people, onChange }: HistoryFiltersFormProps) {
  const [entity, setEntity] = useState(filters.entity ?? '');
  const [action, setAction] = useState<string>(filters.action ?? '');
  const [by, setBy] = useState(filters.by ?? '');
  const [fromDay, setFromDay] = useState(dayOf(filters.from));
  const [toDay, setToDay] = useState(dayOf(filters.to, 1));
  const toBeforeFrom = fromDay !== '' && toDay !== '' && toDay < fromDay;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (toBeforeFrom) return;
    onChange({
      entity: entity || undefined,
      action: (action || undefined) as HistoryFilters['action'],
      by: by || undefined,
      from: fromDay ? dayStart(fromDay) : undefined,
      // The last day is included: the range ends when the next day starts.
      to: toDay ? dayStart(toDay, 1) : undefined,
    });
  };
  const clear = () => {
    setEntity('');
    setAction('');
    setBy('');
    setFromDay('');
    setToDay('');
    onChange({});
  };

  return (
    <form onSubmit={submit} className="grid gap-4 sm:grid-cols-2 lg:grid-cols-5" aria-label="Filter the history">
      <SelectField label="Kind of thing" value={entity} onChange={(e) => setEntity(e.target.value)}>
        <option value="">Everything</option>
        {historyEntities.map((value) => (
          <option key={value} value={value}>
            {value === 'sign-off' ? 'sign-offs' : entityNoun(value)}
          </option>
        ))}
      </SelectField>
      <SelectField label="What happened" value={action} onChange={(e) => setAction(e.target.value)}>
        <option value="">Anything</option>
        {historyActions.map((value) => (
          <option key={value} value={value}>
            {actionVerbs[value]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Who" value={by} onChange={(e) => setBy(e.target.value)}>
        <option value="">Anyone</option>
        {people.map((person) => (
          <option key={person.id} value={person.id}>
            {person.name}
          </option>
        ))}
      </SelectField>
      <TextField label="From" type="date" value={fromDay} onChange={(e) => setFromDay(e.target.value)} />
      <TextField label="To" type="date" value={toDay} onChange={(e) => setToDay(e.target.value)} error={toBeforeFrom ? 'must not be before From' : undefined} />
      <div className="flex gap-2 sm:col-span-2 lg:col-span-5">
        <Button type="submit">Show</Button>
        <Button tone="quiet" onClick={clear}>
          Clear the filters
        </Button>
      </div>
    </form>
  );
}
