import { shortName } from '../../shared/comtrade';
import { AppError } from '../errors';

export interface UploadFormat {
  format: 'csv' | 'comtrade';
  /** The extension the kept original gets: `<id>.csv`, `<id>.cfg` (with `<id>.dat`) or `<id>.cff`. */
  extension: 'csv' | 'cfg' | 'cff';
}

const extensionOf = (name: string) => /\.([A-Za-z0-9]{1,8})$/.exec(name)?.[1].toLowerCase() ?? '';

/** Whether a file sent as the form field `file` is read as a CSV export (not a COMTRADE part). */
export const isCsvName = (name: string) => !['cfg', 'cff', 'dat'].includes(extensionOf(name));

/**
 * What an upload holds, from its file names: a COMTRADE .cfg with its .dat (form fields `file` and
 * `data`), a 2013 combined .cff, or else a CSV export. A half pair is refused before anything is kept.
 */
export function uploadFormat(fileName: string, dataName: string | null): UploadFormat {
  const ext = extensionOf(fileName);
  if (dataName !== null) {
    if (ext !== 'cfg') throw new AppError(400, 'comtrade_pair', `The form field "data" is for the .dat of a COMTRADE record, sent with its .cfg in "file"; "file" holds ${shortName(fileName)}.`);
    if (extensionOf(dataName) !== 'dat') throw new AppError(400, 'comtrade_pair', `The form field "data" must hold the COMTRADE .dat that goes with ${shortName(fileName)}; it holds ${shortName(dataName)}.`);
    return { format: 'comtrade', extension: 'cfg' };
  }
  if (ext === 'cfg') throw new AppError(400, 'comtrade_pair', `${shortName(fileName)} is a COMTRADE configuration: send its .dat with it, in the form field "data".`);
  if (ext === 'cff') return { format: 'comtrade', extension: 'cff' };
  return { format: 'csv', extension: 'csv' };
}
