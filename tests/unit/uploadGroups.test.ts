import { describe, expect, it } from 'vitest';
import { uploadGroups } from '../../src/stores/uploadGroups';

const f = (name: string) => ({ name });
const names = (files: { name: string }[]) => uploadGroups(files).map((g) => ({ file: g.file.name, data: g.data?.name, refused: !!g.refused, note: !!g.note }));

describe('uploadGroups', () => {
  it('a .cfg and a .dat of one base name go up together, whatever their case and order', () => {
    expect(names([f('FAULT_07.DAT'), f('fault_07.cfg')])).toEqual([{ file: 'fault_07.cfg', data: 'FAULT_07.DAT', refused: false, note: false }]);
  });

  it('two records dropped at once make two pairs; other files go up on their own', () => {
    expect(names([f('a.cfg'), f('b.dat'), f('a.dat'), f('scope.csv'), f('b.cfg')])).toEqual([
      { file: 'a.cfg', data: 'a.dat', refused: false, note: false },
      { file: 'scope.csv', data: undefined, refused: false, note: false },
      { file: 'b.cfg', data: 'b.dat', refused: false, note: false },
    ]);
  });

  it('a .cfg alone is held back with a message naming it', () => {
    const [g] = uploadGroups([f('bay4.cfg')]);
    expect(g.refused).toBe('bay4.cfg is a COMTRADE configuration: drop it together with its .dat (same name).');
  });

  it('a .dat alone goes up as a text export, with a note', () => {
    expect(uploadGroups([f('logger.dat')])[0]).toMatchObject({ file: { name: 'logger.dat' }, note: expect.stringMatching(/No \.cfg beside it/) });
  });

  it("a record's .hdr and .inf are left out; on their own they go up like any file", () => {
    expect(names([f('r.cfg'), f('r.dat'), f('r.hdr'), f('r.inf')])).toEqual([{ file: 'r.cfg', data: 'r.dat', refused: false, note: false }]);
    expect(names([f('notes.inf')])).toEqual([{ file: 'notes.inf', data: undefined, refused: false, note: false }]);
  });

  it('a .cff is one upload', () => {
    expect(names([f('record.cff')])).toEqual([{ file: 'record.cff', data: undefined, refused: false, note: false }]);
  });
});
