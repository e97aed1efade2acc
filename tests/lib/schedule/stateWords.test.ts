// The project list's words for a schedule's state (issue 23): a draft with a file is not "waiting for a file".
import { describe, expect, it } from 'vitest';
import { scheduleStateWords, type ScheduleStateInput } from '@/lib/schedule';

const draft: ScheduleStateInput = { status: 'draft', fileName: null, fileRowCount: 0, cleanRowCount: 0, problemCount: 0, uploadRefusal: null, rowCount: 0, sized: 0 };

describe('scheduleStateWords', () => {
  it('tells apart a draft without a file, with a refused upload, with problems and ready to size', () => {
    expect(scheduleStateWords(draft)).toEqual({ words: 'waiting for a file', tone: 'waiting' });
    expect(scheduleStateWords({ ...draft, uploadRefusal: { fileName: 'a.pdf', message: 'not a spreadsheet' } })).toEqual({ words: 'file refused (a.pdf): upload a corrected one', tone: 'problem' });
    expect(scheduleStateWords({ ...draft, fileName: 'a.csv', fileRowCount: 5, cleanRowCount: 3, problemCount: 2 }).tone).toBe('problem');
    expect(scheduleStateWords({ ...draft, fileName: 'a.csv', fileRowCount: 1, cleanRowCount: 1 })).toEqual({ words: 'file checked: 1 circuit ready to size', tone: 'ready' });
  });

  it('counts sized circuits while queued and when done', () => {
    expect(scheduleStateWords({ ...draft, status: 'queued', fileName: 'a.csv', rowCount: 40, sized: 12 }).words).toBe('12 of 40 circuits sized so far');
    expect(scheduleStateWords({ ...draft, status: 'done', fileName: 'a.csv', rowCount: 40, sized: 40 })).toEqual({ words: '40 of 40 circuits sized', tone: 'done' });
  });
});
