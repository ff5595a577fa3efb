// Synthetic Harrow Flats model for the export tests (truth set here: Shmin = 1 MPa + 16.5 kPa/m x TVD).
import type { Grade } from '../../../src-renderer/engine/result';
import { buildRegionalModel, stressTable, type ModelTestInput, type ModelSettings } from '../../../src-renderer/engine/model/regional-model';

export function harrowModel(settings: ModelSettings = {}) {
  const scatter = [0.3, -0.2, 0.1, -0.4, 0.25, -0.1];
  const grades: Grade[] = ['A', 'B', 'A', 'B', 'A', 'C'];
  const tests: ModelTestInput[] = scatter.map((d, i) => {
    const tvd = 900 + 300 * i;
    return {
      testId: `hf-${i}`, file: `cobalt-ridge-hf-${i}.csv`, well: i % 2 ? 'HF-2' : '+HF-1', field: 'Harrow Flats', type: 'xlot',
      tvd, shmin: { value: 1e6 + 16_500 * tvd + d * 1e6, kind: 'estimate', from: 'closure' },
      grade: grades[i], state: 'accepted', reviewer: i % 2 ? 'A. Brandt' : '=cmd|calc',
    };
  });
  const model = buildRegionalModel(tests, settings);
  const rows = stressTable(model, { from: 0, to: 3000, step: 250 });
  return { model, rows };
}
