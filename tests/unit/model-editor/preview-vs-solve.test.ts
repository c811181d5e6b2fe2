/**
 * The browser preview's receiver times equal `npm run solve` on the exported model.
 *
 * Reference: the solve command (FORMATS.md §3), run as a separate process on the model file the
 * editor exports and the demo pick file. The preview side is exactly what the editor page does:
 * the draft is rasterised, the shot is placed with placePreviewShot, and the worker's core
 * (PreviewEngine.solveField, which src/workers/preview.worker.ts calls) computes the field and
 * samples the receivers. Both print ms to 0.1 µs (shared/residuals/csv.ts), so the strings match.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseModelFile, rasteriseModel } from '../../../shared/model';
import { addLayerBelow, defaultModel, formatModelFile, paintCells, rectangleCells, type Point } from '../../../shared/model/edit';
import { parsePickText } from '../../../shared/picks';
import { parseStationCsv } from '../../../shared/stations';
import { sToMs } from '../../../shared/units';
import { placePreviewShot } from '../../../src/components/model/previewShots';
import { PreviewEngine } from '../../../src/workers/preview-core';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'timefield-preview-'));
const ms = (s: number): string => String(+sToMs(s).toFixed(4));

describe('live preview against the solve command', () => {
  it('gives the same receiver times as npm run solve on the exported model, for every pick of every shot', () => {
    // A draft as the editor builds it: default model for TQ-L1, a third layer, a painted low-velocity pocket.
    const stations = parseStationCsv(readFileSync(join(root, 'fixtures/demo/tq-l1.stations.csv'), 'utf8'));
    const pickText = readFileSync(join(root, 'fixtures/demo/tq-l1.picks.csv'), 'utf8');
    const picks = parsePickText(pickText);
    if (!stations.ok || !picks.ok) throw new Error('demo fixtures do not parse');
    let model = defaultModel({ stations: stations.stations, shotXs: picks.shots.map((s) => s.sourceX) });
    model = { ...model, layers: addLayerBelow(model.layers!, 1, model.grid, model.surface as Point[]) };
    const layered = rasteriseModel(model);
    model = { ...model, edits: paintCells([], model.grid, rectangleCells(model.grid, { x: 50, z: 97 }, { x: 60, z: 93 }), 250, layered.active) };
    expect(model.edits!.length).toBeGreaterThan(50);

    const modelPath = join(dir, 'draft.model.json');
    const picksPath = join(dir, 'tq-l1.picks.csv');
    const outPath = join(dir, 'residuals.csv');
    const exported = formatModelFile(model);
    writeFileSync(modelPath, exported);
    writeFileSync(picksPath, pickText);

    const run = spawnSync('npm', ['run', 'solve', '--', '--model', modelPath, '--picks', picksPath, '--json', '--residuals', outPath], {
      cwd: root, encoding: 'utf8', timeout: 120_000,
    });
    expect(run.status, run.stderr).toBe(0);
    const summary = JSON.parse(run.stdout.trim().split('\n').at(-1)!);
    expect(summary.picks).toBe(336);

    const cli = new Map<string, string>();
    for (const line of readFileSync(outPath, 'utf8').trim().split('\n').slice(1)) {
      const [shot, rx, , , computed] = line.split(',');
      cli.set(`${shot}@${rx}`, computed);
    }

    // The preview side reads the exported text back, as the editor's import would.
    const parsed = parseModelFile(JSON.parse(exported));
    if (!parsed.ok) throw new Error('exported model does not parse');
    const raster = rasteriseModel(parsed.model);
    const engine = new PreviewEngine();
    let compared = 0;
    for (const { shotId } of picks.shots) {
      const placed = placePreviewShot(raster, picks.picks, shotId);
      if (!placed.ok) throw new Error(placed.message);
      const { shot } = placed;
      const field = engine.solveField({ grid: raster.grid, velocity: raster.velocity, active: raster.active, cellSlowness: raster.cellSlowness, surface: raster.surface, source: shot.source, receivers: shot.receivers, order: 2 });
      shot.picks.forEach((p, i) => {
        expect(ms(field.receiverTimes[i]), `${shotId} at x ${p.receiverX} m`).toBe(cli.get(`${shotId}@${+p.receiverX.toFixed(6)}`));
        compared++;
      });
    }
    expect(compared).toBe(336);
  }, 180_000);
});
