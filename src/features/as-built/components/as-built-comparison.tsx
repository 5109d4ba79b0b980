import type { AsBuiltComparison, AsBuiltUnitComparison, RangeVerdict } from '../../../../shared/contracts/as-built';
import { Table, Td, Th } from '../../../components/ui/table';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent, formatSignedNumber } from '../../../lib/format';
import { usCustomaryDeviation, usCustomaryRange, usCustomaryText, type AsBuiltQuantity } from './as-built-units';

type Deviation = AsBuiltUnitComparison['movingMassKg'];

/** A signed deviation at three figures unless told ("+10.4"); with its unit and percentage it reads "+10.4 kg (+4.2 %)". */
const signed = (value: number, significant = 3) => formatSignedNumber(value, significant);

type RangeCheck = AsBuiltUnitComparison['massRange'];

const verdictWords: Record<RangeVerdict, string> = { inside: 'in range', below: 'BELOW range', above: 'ABOVE range' };
const verdictMarks: Record<RangeVerdict, string> = { inside: '✓', below: '▼', above: '▲' };

/**
 * A measured value, its deviation from the design ("+10.4 kg (+4.2 %)") and its range check in words with a mark and
 * the range itself, so that nothing rests on colour alone. With `usQuantity` (a person reading US customary units)
 * each value also shows in those units after a "·".
 */
function QuantityCell({
  deviation,
  range,
  unit,
  usQuantity,
}: {
  deviation: Deviation | null;
  range: RangeCheck | null;
  unit: string;
  usQuantity?: AsBuiltQuantity;
}) {
  if (!deviation) return <Td className="align-top text-ink-muted">not given</Td>;
  const outside = range !== null && range.verdict !== 'inside';
  const us = (text: string) => <span className="text-ink-soft"> · {text}</span>;
  return (
    <Td className="whitespace-nowrap align-top tabular-nums">
      <span className="block text-ink">
        {formatNumber(deviation.measuredValue, 4)} {unit}
        {usQuantity ? us(usCustomaryText(usQuantity, deviation.measuredValue)) : null}
      </span>
      <span className="block text-caption text-ink-muted">
        {signed(deviation.absolute)} {unit} ({signed(deviation.percent, 2)} %)
        {usQuantity ? ` · ${usCustomaryDeviation(usQuantity, deviation.absolute)}` : null}
      </span>
      {range ? (
        <span className={`mt-0.5 block text-caption ${outside ? 'font-semibold text-signal-error' : 'text-signal-ok'}`}>
          <span aria-hidden="true">{verdictMarks[range.verdict]} </span>
          {verdictWords[range.verdict]} {formatNumber(range.low, 3)}–{formatNumber(range.high, 3)}
          {usQuantity ? ` (${usCustomaryRange(usQuantity, range.low, range.high)})` : null}
        </span>
      ) : null}
    </Td>
  );
}

function UnitRow({ unit, withUs }: { unit: AsBuiltUnitComparison; withUs: boolean }) {
  const outside = !unit.withinTuningRange;
  return (
    <tr className={outside ? 'bg-signal-error-bg/50' : undefined}>
      <Td className="whitespace-nowrap align-top font-semibold">
        Unit {unit.unitNumber}
        {outside ? (
          <span className="mt-0.5 block text-caption font-semibold text-signal-error">
            <span aria-hidden="true">⚠ </span>Outside
          </span>
        ) : (
          <span className="mt-0.5 block text-caption font-normal text-signal-ok">
            <span aria-hidden="true">✓ </span>All in range
          </span>
        )}
      </Td>
      <QuantityCell deviation={unit.movingMassKg} range={unit.massRange} unit="kg" usQuantity={withUs ? 'mass' : undefined} />
      <QuantityCell deviation={unit.springRateNPerM} range={unit.springRateRange} unit="N/m" usQuantity={withUs ? 'stiffness' : undefined} />
      <QuantityCell deviation={unit.frequencyHz} range={unit.frequencyRange} unit="Hz" />
      <QuantityCell deviation={unit.impliedFrequencyHz} range={unit.impliedFrequencyRange} unit="Hz" />
    </tr>
  );
}

/**
 * The comparison of one record with the hardware sheet: per unit the measured values, their deviation from the
 * design (absolute and %), each range check in words, the warnings in plain words, and the mass ratio built.
 */
export function AsBuiltComparisonView({ comparison, caption }: { comparison: AsBuiltComparison; caption: string }) {
  const { design } = comparison;
  const outside = comparison.unitsOutsideRange;
  const withUs = useDisplayUnits().system === 'us-customary';
  const lb = (massKg: number) => (withUs ? ` (${usCustomaryText('mass', massKg)})` : '');
  return (
    <div className="flex flex-col gap-4">
      {comparison.warnings.length > 0 ? (
        <div role="alert" className="rounded-plate border-2 border-signal-error bg-signal-error-bg px-4 py-3 text-small text-ink">
          <p className="font-semibold text-signal-error">
            <span aria-hidden="true">⚠ </span>
            {outside.length > 0
              ? `Outside the tuning range: unit${outside.length === 1 ? '' : 's'} ${outside.join(', ')}`
              : 'Check before acceptance'}
          </p>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {comparison.warnings.map((warning) => (
              <li key={warning}>{warning}</li>
            ))}
          </ul>
        </div>
      ) : (
        <p role="status" className="rounded-plate border border-signal-ok/30 bg-signal-ok-bg px-4 py-2 text-small font-medium text-signal-ok">
          <span aria-hidden="true">✓ </span>
          Every unit recorded is inside the tuning range of the hardware sheet.
        </p>
      )}
      <Table caption={caption}>
        <thead>
          <tr>
            <Th>Unit</Th>
            <Th>Moving mass{withUs ? ' (kg · lb)' : ''} · range at design springs</Th>
            <Th>Spring rate{withUs ? ' (N/m · lbf/in)' : ''} · range at design mass</Th>
            <Th>Tuned frequency, measured · tuning range</Th>
            <Th>Frequency from spring rate and moving mass · tuning range</Th>
          </tr>
        </thead>
        <tbody>
          {comparison.units.map((unit) => (
            <UnitRow key={unit.unitNumber} unit={unit} withUs={withUs} />
          ))}
        </tbody>
      </Table>
      <dl className="grid gap-x-6 gap-y-1 text-small sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold text-ink-soft">Moving mass of the {comparison.recordedUnitCount} unit{comparison.recordedUnitCount === 1 ? '' : 's'} recorded</dt>
        <dd className="tabular-nums">
          {formatNumber(comparison.recordedMovingMassKg.measuredValue, 4)} kg{lb(comparison.recordedMovingMassKg.measuredValue)} against{' '}
          {formatNumber(comparison.recordedMovingMassKg.designValue, 4)} kg{lb(comparison.recordedMovingMassKg.designValue)} designed (
          {signed(comparison.recordedMovingMassKg.percent, 2)} %)
        </dd>
        <dt className="font-semibold text-ink-soft">Mass ratio built</dt>
        <dd className="tabular-nums">
          {comparison.builtMassRatio === null
            ? `known once all ${comparison.unitCount} units are recorded`
            : `${formatPercent(comparison.builtMassRatio, 3)} of the modal mass (${formatNumber(design.modalMassKg, 4)} kg${withUs ? ` · ${usCustomaryText('mass', design.modalMassKg)}` : ''}), designed ${formatPercent(design.massRatio, 3)}`}
        </dd>
      </dl>
    </div>
  );
}
