// The document rules of issue 23, as the issue states them: approved revisions are never deleted,
// only archived; a duplicate names its origin; deletions are restorable for 30 days, by admins.
import { describe, expect, it } from 'vitest';
import { duplicateName, duplicateSheetTitle, mayManage, projectDeleteRefusal, restorable, sheetRefusal } from '@/lib/documents/rules';

describe('sheet states', () => {
  it('never lets an approved revision be deleted, but lets it be archived and duplicated', () => {
    expect(sheetRefusal('delete', 'approved')).toMatch(/never deleted/);
    expect(sheetRefusal('archive', 'approved')).toBeNull();
    expect(sheetRefusal('duplicate', 'approved')).toBeNull();
  });

  it('lets a draft or returned sheet be renamed and deleted; a sheet in review waits for a decision', () => {
    for (const status of ['draft', 'returned'] as const) {
      expect(sheetRefusal('rename', status)).toBeNull();
      expect(sheetRefusal('delete', status)).toBeNull();
    }
    for (const op of ['rename', 'delete', 'archive'] as const) expect(sheetRefusal(op, 'in_review')).toMatch(/withdraw/);
  });

  it('refuses to delete a project that holds an approved revision', () => {
    expect(projectDeleteRefusal(0)).toBeNull();
    expect(projectDeleteRefusal(2)).toMatch(/2 approved revisions/);
  });
});

describe('names of copies', () => {
  it('names the origin and its revision', () => {
    expect(duplicateSheetTitle('Chiller feeder', 3)).toBe('Copy of Chiller feeder from revision 3');
    const long = duplicateSheetTitle('x'.repeat(300), 12);
    expect(long.length).toBe(200);
    expect(long.endsWith(' from revision 12')).toBe(true);
  });

  it('gives a project or schedule copy a name not yet taken', () => {
    expect(duplicateName('Yard')).toBe('Copy of Yard');
    expect(duplicateName('Yard', ['Copy of Yard', 'Copy of Yard (2)'])).toBe('Copy of Yard (3)');
  });
});

describe('rights and retention', () => {
  it('follows the rights table: designers manage projects, sheets, schedules; reviewers and viewers nothing; restore is for admins', () => {
    for (const kind of ['project', 'sheet', 'schedule'] as const) {
      expect(mayManage('designer', kind, 'delete')).toBe(true);
      expect(mayManage('reviewer', kind, 'rename')).toBe(false);
      expect(mayManage('viewer', kind, 'archive')).toBe(false);
      expect(mayManage('designer', kind, 'restore')).toBe(false);
      expect(mayManage('admin', kind, 'restore')).toBe(true);
    }
  });

  it('keeps a deletion restorable for 30 days and not after', () => {
    const deleted = new Date('2026-01-01T00:00:00Z');
    expect(restorable(deleted, new Date('2026-01-30T23:59:00Z'))).toBe(true);
    expect(restorable(deleted, new Date('2026-01-31T00:00:01Z'))).toBe(false);
  });
});
