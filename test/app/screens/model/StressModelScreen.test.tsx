import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { StressModelScreen } from '../../../../src-renderer/app/screens/model/StressModelScreen';
import type { ModelTestInput } from '../../../../src-renderer/engine/model/regional-model';

// Synthetic Harrow Flats tests; truth Shmin = 1 MPa + 16.5 kPa/m x TVD.
const tests: ModelTestInput[] = [700, 1200, 1700, 2200, 2700].map((tvd, i) => ({
  testId: `t${i}`, file: `hf-${i}.csv`, well: `HF-${1 + (i % 2)}`, field: 'Harrow Flats', tvd,
  shmin: { value: 1e6 + 16_500 * tvd + (i % 2 ? 1e5 : -1e5), kind: 'estimate', from: 'closure' },
  grade: 'A', state: i === 4 ? 'rejected' : 'accepted', reviewer: 'A. Brandt',
}));

describe('StressModelScreen', () => {
  it('should show the fitted trend, the accepted tests with who signed them off, and the safety note', () => {
    const html = renderToStaticMarkup(
      <StressModelScreen tests={tests} units="si" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null} />,
    );
    expect(html).toMatch(/Shmin = 0\.\d\d MPa \+ 16\.\d\d kPa\/m × TVD/);
    expect(html).toContain('n 4');
    expect((html.match(/data-testid="model-test-row"/g) ?? []).length).toBe(4);
    expect(html).toContain('A. Brandt');
    expect(html).not.toContain('hf-4.csv');
    expect(html).toContain('qualified engineer');
    expect(html).toContain('data-testid="export-csv"');
  });

  it('should say why there is no trend with too few accepted tests', () => {
    const html = renderToStaticMarkup(
      <StressModelScreen tests={tests.slice(0, 2)} units="oilfield" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null} />,
    );
    expect(html).toContain('No Shmin trend');
    expect(html).toContain('TVD [ft]');
  });
});
