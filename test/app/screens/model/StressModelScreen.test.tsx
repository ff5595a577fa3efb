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
    expect(html).toContain('TVD (ft)');
  });

  // One well chosen (HF-1 only); its survey is vertical to 1000 m then a 30 deg hold (truth set here).
  const hf1 = tests.filter((t) => t.well === 'HF-1');
  const survey = [{ md: 0, inc: 0, azi: 0 }, { md: 1000, inc: 0, azi: 0 }, { md: 1001, inc: 30, azi: 90 }, { md: 4000, inc: 30, azi: 90 }];

  it('should show the MD column of a single well with a survey and the Pp measurements loaded', () => {
    const html = renderToStaticMarkup(
      <StressModelScreen tests={hf1} units="si" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null}
        wells={[{ id: 'w1', name: 'HF-1', fieldName: 'Harrow Flats', survey }]}
        porePressurePoints={{ file: 'hf1-pp.csv', points: [{ tvd: 1000, pressure: 10.5e6, line: 2, well: 'HF-1' }, { tvd: 2000, pressure: 23e6, line: 3, well: 'HF-1' }] }} />,
    );
    expect(html).toContain('MD (m)');
    expect(html).toContain('data-testid="model-survey"');
    expect(html).toContain('Pp through 2 measurements from hf1-pp.csv');
    expect(html).toContain('Pp gradient below the deepest point');
    // Table row at 1500 m TVD: Pp on the straight line 10.5 to 23 MPa (16.75 MPa, set here).
    expect(html).toMatch(/<tr><td[^>]*>1,500<\/td><td[^>]*>[\d,]+<\/td><td[^>]*>16\.75<\/td>/);
  });

  it('should offer to load a survey for a single well without one, and Pp measurements, when files can be opened', () => {
    const html = renderToStaticMarkup(
      <StressModelScreen tests={hf1} units="si" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null}
        wells={[{ id: 'w1', name: 'HF-1', fieldName: 'Harrow Flats' }]}
        openFiles={async () => []} saveWellSurvey={async () => undefined} />,
    );
    expect(html).toContain('data-testid="model-load-survey"');
    expect(html).toContain('Load survey for HF-1');
    expect(html).toContain('data-testid="model-load-pp-points"');
    expect(html).not.toContain('MD (m)');
  });

  it('should name the test whose lower bound contradicts the trend, with plain words and grouped numbers', () => {
    // A FIT lower bound of 30 MPa at 1500 m lies far above the synthetic trend (1 MPa + 16.5 kPa/m x 1500 m = 25.75 MPa).
    const fit: ModelTestInput = { testId: 'fit', file: 'hf-fit.csv', well: 'HF-1', field: 'Harrow Flats', tvd: 1500, shmin: { value: 30e6, kind: 'lower-bound', from: 'fitMaximum' }, grade: 'B', state: 'accepted', reviewer: 'A. Brandt' };
    const html = renderToStaticMarkup(
      <StressModelScreen tests={[...tests, fit]} units="si" appVersion="0.1.0" onOpenTest={() => undefined} saveFile={async () => null} />,
    );
    expect(html).toContain('The trend contradicts a bound');
    expect(html).toContain('HF-1 at TVD 1,500 m: lower bound 30.00 MPa (hf-fit.csv)');
    expect(html).toContain('<span class="hint">lower bound </span>30.00');
    expect(html).not.toContain('(lower-bound)');
    expect(html).toContain('>Accepted<');
    expect(html).toContain('B square');
  });
});
