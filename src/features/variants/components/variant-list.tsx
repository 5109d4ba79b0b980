import { Link } from 'react-router-dom';
import type { Variant } from '../../../../shared/contracts';
import { Table, Td, Th } from '../../../components/ui/table';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent } from '../../../lib/format';
import type { ModeChoice } from '../api/variants';
import { describeTuning } from './labels';
import { UtilisationBar, VerdictTag } from './verdict-tag';

interface VariantListProps {
  projectId: string;
  variants: readonly Variant[];
  modes: readonly ModeChoice[];
  selected: readonly string[];
  onToggle: (variantId: string) => void;
}

/** The project's tuning variants, each with its governing verdict; ticked ones are compared below. */
export function VariantList({ projectId, variants, modes, selected, onToggle }: VariantListProps) {
  const units = useDisplayUnits();
  return (
    <Table caption="Tuning variants">
      <thead>
        <tr>
          <Th className="w-16">Compare</Th>
          <Th>Variant</Th>
          <Th>Mode</Th>
          <Th className="text-right">Mass ratio</Th>
          <Th>Tuning</Th>
          <Th className="text-right">Governing peak</Th>
          <Th>Use of limit</Th>
          <Th>Verdict</Th>
        </tr>
      </thead>
      <tbody>
        {variants.map((variant) => {
          const mode = modes.find((m) => m.mode.id === variant.modeId);
          const result = variant.result;
          return (
            <tr key={variant.id}>
              <Td>
                <input
                  type="checkbox"
                  className="size-4 accent-tide-700"
                  aria-label={`Compare ${variant.name}`}
                  checked={selected.includes(variant.id)}
                  onChange={() => onToggle(variant.id)}
                />
              </Td>
              <Td>
                <Link to={`/projects/${projectId}/tuning-variants/${variant.id}`} className="font-semibold text-tide-800 underline-offset-4 hover:underline">
                  {variant.name}
                </Link>
              </Td>
              <Td className="text-ink-soft">{mode ? mode.mode.label : '—'}
                {mode ? <div className="text-caption text-ink-muted">{formatNumber(mode.mode.frequencyHz, 4)} Hz</div> : null}</Td>
              <Td className="text-right tabular-nums">{formatPercent(variant.massRatio, 3)}</Td>
              <Td className="text-ink-soft">{describeTuning(variant.tuning)}</Td>
              <Td className="text-right tabular-nums">{units.format('acceleration', result?.governing.peakAccelerationMPerS2, 3)}</Td>
              <Td>
                <UtilisationBar utilisation={result?.governing.utilisation} />
              </Td>
              <Td>{result ? <VerdictTag verdict={result.governing.verdict} size="small" /> : <span className="text-signal-error">no result</span>}</Td>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
