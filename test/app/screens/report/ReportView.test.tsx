import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { TestDetail } from '../../../../src-renderer/archive/api';
import type { ArchiveEvent } from '../../../../src-renderer/archive/events';
import { ReportView } from '../../../../src-renderer/app/screens/report/ReportView';
import { analyzeRecord } from '../../../../src-renderer/engine/analyze';
import { generateSyntheticTest } from '../../../../src-renderer/engine/synthetic/generate';

// A synthetic Harrow Flats XLOT (Cobalt Ridge Test Services) whose truth is set here.
function detail(): TestDetail {
  const { record } = generateSyntheticTest({ type: 'xlot', seed: 3, depthTvd: 1800, shmin: 1e6 + 16_500 * 1800, metadata: { well: 'HF-2', field: 'Harrow Flats', contractor: 'Cobalt Ridge Test Services' } });
  const analysis = analyzeRecord(record, {});
  const envelope = (id: string, author: string, time: string) => ({ id, author, device: 'd1', time, clock: 1, prev: '' });
  const log: ArchiveEvent[] = [
    { ...envelope('e1', 'Maren Holt', '2026-11-30T10:00:00Z'), body: { kind: 'review-requested', testId: 't1' } },
    { ...envelope('e2', 'Idris Calloway', '2026-11-30T11:00:00Z'), body: { kind: 'signed-off', testId: 't1', grade: analysis.quality.grade, picksVersion: 'v1' } },
  ];
  return {
    summary: {
      id: 't1', fieldId: 'f1', fieldName: 'Harrow Flats', wellId: 'w2', wellName: 'HF-2', type: analysis.type, typeInferred: analysis.typeInferred,
      depthTvd: 1800, depthMd: 1810, shmin: analysis.stress.shmin?.value ?? null, shminKind: analysis.stress.shmin?.kind ?? null,
      grade: analysis.quality.grade, state: 'accepted', reviewer: 'Idris Calloway', lastPickAuthor: null,
      fileName: 'HF-2_XLOT_1800m.csv', fileHash: 'abc', importedAt: '2026-11-30T09:00:00Z', importedBy: 'Maren Holt',
    },
    metadata: analysis.metadata,
    samples: { time: record.time, pressure: record.pressure, rate: record.rate, volume: record.volume },
    analysis,
    manualPicks: [],
    log,
  };
}

describe('ReportView', () => {
  it('should list picks, criteria, the review log and the safety caution for each test', () => {
    const d = detail();
    const html = renderToStaticMarkup(<ReportView details={[d, { ...d, summary: { ...d.summary, id: 't2' } }]} units="si" title="HF-2 review report" generatedAt="2026-12-01T12:00:00Z" generatedBy="Idris Calloway" />);
    expect((html.match(/data-testid="report-test"/g) ?? []).length).toBe(2);
    expect(html).toContain('Closure');
    for (const c of d.analysis.quality.criteria) expect(html).toContain(c.id);
    expect(html).toContain('Signed off with grade');
    expect(html).toContain('Idris Calloway');
    expect(html).toContain('qualified engineer');
    expect(html).toContain('Cobalt Ridge Test Services');
  });
});
