import type { ModalSolution } from '../../../../shared/engine/modal';
import { Table, Td, Th } from '../../../components/ui/table';
import { Unit } from '../../../components/ui/unit';
import { formatNumber } from '../../../lib/format';
import { dofName } from './lumped-model-analysis';
import { scaleToUnitMax } from './lumped-model-math';

/** The undamped modes of a model: frequency, angular frequency, period and the shape scaled to 1 at its largest entry. */
export function ModelModesTable({ modes, dofLabels }: { modes: ModalSolution; dofLabels: readonly string[] }) {
  return (
    <Table caption="Undamped modes of the model">
      <thead>
        <tr>
          <Th>Mode</Th>
          <Th className="text-right">Frequency <Unit>Hz</Unit></Th>
          <Th className="text-right"><span className="normal-case">ω</span> <Unit>rad/s</Unit></Th>
          <Th className="text-right">Period <Unit>s</Unit></Th>
          {dofLabels.map((_, index) => (
            <Th key={index} className="text-right" title={dofName(dofLabels, index)}>
              <span className="normal-case">φ at {dofLabels[index]?.trim() || `DOF ${index + 1}`}</span>
            </Th>
          ))}
        </tr>
      </thead>
      <tbody>
        {modes.shapes.map((shape, r) => {
          const scaled = scaleToUnitMax(shape);
          const frequencyHz = modes.frequencyHz[r];
          return (
            <tr key={r}>
              <Td className="font-semibold">{r + 1}</Td>
              <Td className="text-right tabular-nums">{formatNumber(frequencyHz, 4)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(modes.angularFrequencyRadPerS[r], 4)}</Td>
              <Td className="text-right tabular-nums">{frequencyHz > 0 ? formatNumber(1 / frequencyHz, 4) : 'rigid body'}</Td>
              {scaled.map((value, index) => (
                <Td key={index} className="text-right tabular-nums">
                  {formatNumber(value, 3)}
                </Td>
              ))}
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
