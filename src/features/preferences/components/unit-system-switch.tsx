import { useQuery } from '@tanstack/react-query';
import { unitSystems, type UnitSystem } from '../../../../shared/contracts';
import { preferencesQueryOptions, useUpdatePreferences } from '../api/preferences';

const short: Record<UnitSystem, { text: string; title: string }> = {
  si: { text: 'SI', title: 'SI units: kg, N, m, mm, m/s²' },
  'us-customary': { text: 'US', title: 'US customary units: lb, lbf, ft, in, %g' },
};

/**
 * The person's display units, as two small segments beside their name. Stored values and the API stay SI; only
 * what the screens show and what the forms take changes.
 */
export function UnitSystemSwitch() {
  const preferences = useQuery(preferencesQueryOptions());
  const update = useUpdatePreferences();
  const current = preferences.data?.unitSystem ?? 'si';
  return (
    <div role="radiogroup" aria-label="Display units" className="flex items-center rounded-plate border border-paper-line bg-paper p-0.5">
      {unitSystems.map((system) => {
        const checked = current === system;
        return (
          <button
            key={system}
            type="button"
            role="radio"
            aria-checked={checked}
            title={short[system].title}
            disabled={preferences.isPending || update.isPending}
            onClick={() => {
              if (!checked) update.mutate({ unitSystem: system });
            }}
            className={`rounded-[0.25rem] px-2 py-1 text-caption font-semibold ${
              checked ? 'bg-ink text-paper-raised' : 'text-ink-soft hover:bg-paper-sunk'
            }`}
          >
            {short[system].text}
            <span className="sr-only"> — {short[system].title}</span>
          </button>
        );
      })}
    </div>
  );
}

/** The person's unit system for the provider at the top of the signed-in pages (SI until known). */
export function useUnitSystemPreference(enabled: boolean): UnitSystem {
  const preferences = useQuery({ ...preferencesQueryOptions(), enabled });
  return preferences.data?.unitSystem ?? 'si';
}
