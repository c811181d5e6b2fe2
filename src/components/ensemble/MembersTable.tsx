import type { EnsembleMemberView } from '../../../shared/schemas/ensembles';
import { ScrollTable } from '../line/ScrollTable';
import { Td, Th, Tr } from '../Table';

const STATUS_WORDS: Record<EnsembleMemberView['status'], string> = { queued: 'waiting', running: 'running', done: 'done', failed: 'failed', cancelled: 'cancelled' };

/** Every member: its draws, who ran it, how it fitted; members above the χ² limit are marked as left out. */
export function MembersTable({ members, maxChi2 }: { members: EnsembleMemberView[]; maxChi2: number | null }) {
  return (
    <ScrollTable caption="Ensemble members" testId="ensemble-members" minWidth="48rem">
      <thead>
        <tr>
          <Th numeric>#</Th>
          <Th>State</Th>
          <Th numeric>v0 ×</Th>
          <Th numeric>Gradient ×</Th>
          <Th numeric>Weight ×</Th>
          <Th numeric>v* (m/s)</Th>
          <Th numeric>χ²</Th>
          <Th numeric>Iterations</Th>
          <Th numeric>Seconds</Th>
          <Th>Worker</Th>
        </tr>
      </thead>
      <tbody>
        {members.map((m) => {
          const left = maxChi2 !== null && m.status === 'done' && (m.chi2 === null || m.chi2 > maxChi2);
          return (
            <Tr key={m.index}>
              <Td numeric>{m.index + 1}</Td>
              <Td>
                {STATUS_WORDS[m.status]}
                {left && <span className="ml-1 text-amber-800">· left out</span>}
                {m.attempts > 1 && <span className="ml-1 text-stone-600">· {m.attempts} attempts</span>}
                {m.error && <span className="block text-sm text-red-800">{m.error}</span>}
              </Td>
              <Td numeric>{m.plan.v0Factor.toFixed(2)}</Td>
              <Td numeric>{m.plan.kFactor.toFixed(2)}</Td>
              <Td numeric>{m.plan.smoothingFactor.toFixed(2)}</Td>
              <Td numeric>{m.plan.rockVelocity}</Td>
              <Td numeric>{m.chi2 === null ? '—' : m.chi2.toFixed(2)}</Td>
              <Td numeric>{m.iterations ?? '—'}</Td>
              <Td numeric>{m.seconds === null ? '—' : m.seconds.toFixed(1)}</Td>
              <Td className="font-mono text-sm">{m.worker ?? '—'}</Td>
            </Tr>
          );
        })}
      </tbody>
    </ScrollTable>
  );
}
