/**
 * What state a schedule is in, in words, for the project list (issue 23): a draft is not always
 * "waiting for a file" — it may hold a checked file ready to size, a file with problems, or have
 * had its last upload refused.
 */
export interface ScheduleStateInput {
  status: 'draft' | 'queued' | 'done';
  fileName: string | null;
  fileRowCount: number;
  cleanRowCount: number;
  problemCount: number;
  uploadRefusal: { fileName: string; message: string } | null;
  rowCount: number;
  sized: number;
}

export type ScheduleStateTone = 'waiting' | 'ready' | 'problem' | 'running' | 'done';

const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;

export function scheduleStateWords(s: ScheduleStateInput): { words: string; tone: ScheduleStateTone } {
  if (s.status === 'queued') return { words: `${s.sized} of ${plural(s.rowCount, 'circuit', 'circuits')} sized so far`, tone: 'running' };
  if (s.status === 'done') return { words: `${s.sized} of ${plural(s.rowCount, 'circuit', 'circuits')} sized`, tone: 'done' };
  if (s.fileName === null) {
    return s.uploadRefusal
      ? { words: `file refused (${s.uploadRefusal.fileName}): upload a corrected one`, tone: 'problem' }
      : { words: 'waiting for a file', tone: 'waiting' };
  }
  if (s.problemCount > 0) return { words: `file checked: ${plural(s.cleanRowCount, 'clean row', 'clean rows')}, problems to correct; not sized yet`, tone: 'problem' };
  return { words: `file checked: ${plural(s.cleanRowCount, 'circuit', 'circuits')} ready to size`, tone: 'ready' };
}
