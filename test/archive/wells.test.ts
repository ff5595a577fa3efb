import { describe, expect, it } from 'vitest';
import { openTestArchive } from './support/open';
import { simpleFile } from './support/engine';
import { ArchiveError } from '../../src-renderer/archive/errors';

// Survey stations as MD (m), inclination 0-180 degrees and azimuth 0-360 degrees (ISCWSA
// conventions, shared/reference); the stations here are synthetic.

describe('archive wells', () => {
  it('should keep a well survey and log it', async () => {
    const { archive } = await openTestArchive();
    await archive.importFiles([simpleFile('a.csv', 'HF-3')], 'Ana Petrov');
    const [well] = await archive.listWells();
    const stations = [{ md: 0, inc: 0, azi: 0 }, { md: 1000, inc: 12.5, azi: 45 }, { md: 2000, inc: 30, azi: 47.5 }];
    const saved = await archive.setWellSurvey(well.id, stations, 'Ana Petrov', 'HF-3_survey.csv');
    expect(saved.survey).toEqual(stations);
    expect((await archive.listWells(well.fieldId))[0].survey).toEqual(stations);
    const events = await archive.listEvents();
    expect(events.at(-1)!.body).toEqual({ kind: 'survey-set', wellId: well.id, stations, sourceFile: 'HF-3_survey.csv' });
  });

  it('should refuse stations out of range or with depth not increasing', async () => {
    const { archive } = await openTestArchive();
    await archive.importFiles([simpleFile('a.csv', 'HF-3')], 'Ana Petrov');
    const [well] = await archive.listWells();
    await expect(archive.setWellSurvey(well.id, [{ md: 0, inc: 190, azi: 0 }], 'Ana')).rejects.toBeInstanceOf(ArchiveError);
    await expect(archive.setWellSurvey(well.id, [{ md: 0, inc: 0, azi: 360 }], 'Ana')).rejects.toBeInstanceOf(ArchiveError);
    await expect(archive.setWellSurvey(well.id, [{ md: 100, inc: 0, azi: 0 }, { md: 100, inc: 1, azi: 0 }], 'Ana')).rejects.toThrow(/must increase/);
    await expect(archive.setWellSurvey('nope', [], 'Ana')).rejects.toMatchObject({ code: 'not-found' });
  });
});
