/**
 * The report wired to the app: loads one test, or every test of a well (by well name and
 * field), and prints through the bridge.
 */
import { useEffect, useState } from 'react';
import type { TestDetail } from '../../../archive/api';
import { useApp } from '../../context';
import { ReportView } from './ReportView';

/** Props: either a test id, or a well name (optionally with its field). */
export interface ConnectedReportScreenProps {
  testId?: string;
  wellName?: string;
  fieldName?: string;
}

export function ConnectedReportScreen({ testId, wellName, fieldName }: ConnectedReportScreenProps) {
  const { archive, bridge, units, user } = useApp();
  const [details, setDetails] = useState<TestDetail[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [generatedAt] = useState(() => new Date().toISOString());

  useEffect(() => {
    let alive = true;
    (async () => {
      const ids = testId
        ? [testId]
        : (await archive.listTests({ sortBy: 'depthTvd' }))
          .filter((t) => t.wellName === wellName && (fieldName === undefined || t.fieldName === fieldName))
          .map((t) => t.id);
      const loaded: TestDetail[] = [];
      for (const id of ids) loaded.push(await archive.getTest(id));
      if (alive) setDetails(loaded);
    })().catch((e: unknown) => { if (alive) setError(e instanceof Error ? e.message : String(e)); });
    return () => { alive = false; };
  }, [archive, testId, wellName, fieldName]);

  if (error) return <div className="page"><div className="notice bad" role="alert">{error}</div></div>;
  if (!details) return <div className="page" aria-busy="true"><p className="hint">Preparing the report…</p></div>;
  const title = testId && details[0]
    ? `${details[0].summary.wellName} ${details[0].analysis.type.toUpperCase()} review report`
    : `${wellName ?? ''} review report`;
  return (
    <>
      <div className="row no-print" style={{ padding: '12px 24px 0' }}>
        <button type="button" className="btn primary" data-testid="report-print" onClick={() => void bridge.printReport(`${title.replace(/\s+/g, '-')}.pdf`)}>Print or save as PDF</button>
      </div>
      <ReportView details={details} units={units} title={title} generatedAt={generatedAt} generatedBy={user} />
    </>
  );
}
