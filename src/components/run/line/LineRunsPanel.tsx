import type { LineDetail } from '../../../api/types';
import { Section } from '../../Section';
import { canStartRuns, StartRunForm } from '../StartRunForm';
import { LineRunsTable } from './LineRunsTable';

/** Everything about forward runs for one line: start one, and the list of runs with their headline misfit. */
export function LineRunsPanel({ line }: { line: LineDetail }) {
  return (
    <>
      {canStartRuns(line.myRole) && (
        <Section title="Start a forward run" description="Solve the first arrivals of every shot through a saved model version and compare them with a pick set.">
          <div className="rounded-lg border border-stone-200 bg-white p-5 shadow-xs">
            <StartRunForm line={line} />
          </div>
        </Section>
      )}
      <Section title="Runs">
        <LineRunsTable line={line} />
      </Section>
    </>
  );
}
