/**
 * The stress model screen wired to the app: tests from the archive (reloaded on every
 * change), well elevations and surveys (a survey loaded on the screen is stored with the
 * archive's setWellSurvey), the bridge's saveFile and openFiles, navigation to a test on click. The
 * analyses of accepted multi-cycle tests are loaded afterwards for their reopening SHmax.
 */
import { useEffect, useState } from 'react';
import type { TestSummary } from '../../../archive/api';
import type { ModelTestInput } from '../../../engine/model/regional-model';
import { useApp } from '../../context';
import { modelInputFromSummary } from './modelInputs';
import { StressModelScreen, type ModelWell } from './StressModelScreen';

/** Most analyses loaded for reopening SHmax points (each is a re-analysis in the worker). */
const MAX_DETAILS = 40;

export function ConnectedStressModelScreen() {
  const { archive, bridge, units, user, navigate, notify } = useApp();
  const [tests, setTests] = useState<ModelTestInput[] | null>(null);
  const [wells, setWells] = useState<ModelWell[]>([]);
  const [version, setVersion] = useState('');

  useEffect(() => {
    let alive = true;
    void bridge.appVersion().then((v) => { if (alive) setVersion(v); }).catch(() => undefined);
    const load = async () => {
      const [summaries, fields, wellRows] = await Promise.all([archive.listTests(), archive.listFields(), archive.listWells()]);
      if (!alive) return;
      const fieldName = new Map(fields.map((f) => [f.id, f.name]));
      setWells(wellRows.map((w) => ({ id: w.id, name: w.name, fieldName: fieldName.get(w.fieldId) ?? '', rigFloorElevation: w.rigFloorElevation, waterDepth: w.waterDepth, survey: w.survey })));
      setTests(summaries.map((s) => modelInputFromSummary(s)));
      const multiCycle = summaries.filter((s: TestSummary) => s.state === 'accepted' && s.type === 'xlot').slice(0, MAX_DETAILS);
      const details = new Map<string, ModelTestInput>();
      for (const s of multiCycle) {
        try {
          const d = await archive.getTest(s.id);
          details.set(s.id, modelInputFromSummary(s, d.analysis));
        } catch {
          // A test that cannot be re-analysed keeps its summary values; its page shows why.
        }
        if (!alive) return;
      }
      if (details.size) setTests(summaries.map((s) => details.get(s.id) ?? modelInputFromSummary(s)));
    };
    void load();
    const off = archive.subscribe(() => { void load(); });
    return () => { alive = false; off(); };
  }, [archive, bridge]);

  return (
    <StressModelScreen
      tests={tests ?? []}
      loading={tests === null}
      units={units}
      wells={wells}
      user={user}
      appVersion={version || 'unknown'}
      onOpenTest={(testId) => navigate({ screen: 'test', testId })}
      saveFile={(name, bytes, mime) => bridge.saveFile(name, bytes, mime)}
      openFiles={(options) => bridge.openFiles(options)}
      saveWellSurvey={async (well, stations, sourceFile) => {
        if (well.id === undefined) throw new Error(`well ${well.name} is not in the archive`);
        await archive.setWellSurvey(well.id, stations, user, sourceFile);
      }}
      notify={notify}
    />
  );
}
