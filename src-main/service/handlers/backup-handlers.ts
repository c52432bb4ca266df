import * as v from 'valibot';
import { existsSync, statSync } from 'node:fs';
import { isAbsolute, resolve } from 'node:path';
import { backUpStore } from '../../store/backup';
import { ServiceError } from '../contract';
import { defineHandler } from '../define-handler';
import { record } from '../schemas/field-builders';

const destination = () =>
  v.pipe(
    v.string('must be text'),
    v.minLength(1, 'is required'),
    v.maxLength(4096, 'must be at most 4096 characters'),
    v.check((p) => !p.includes('\u0000'), 'must not hold a NUL character'),
    v.check((p) => isAbsolute(p), 'must be a full path to a file, such as /home/me/rigbook-backup.sqlite'),
  );

const WRITE_ERRORS = new Set(['EACCES', 'EPERM', 'ENOENT', 'EROFS', 'ENOSPC', 'EISDIR', 'ENOTDIR', 'SQLITE_CANTOPEN', 'SQLITE_FULL', 'SQLITE_READONLY']);

/**
 * A consistent copy of the open store (SQLite's online backup: writes may go on meanwhile).
 * The desktop shell's File › Back up… calls this with the file the person chose.
 */
export const backupStoreHandler = defineHandler(record({ destination: destination() }), async (ctx, input) => {
  const raw = ctx.raw;
  if (!raw) throw new ServiceError('invalid', 'destination: this store is not a file that can be copied', 'destination');
  const target = resolve(input.destination);
  const live = resolve(raw.name);
  if ([live, `${live}-wal`, `${live}-shm`].includes(target)) {
    throw new ServiceError('invalid', 'destination: is the store itself; choose another file for the backup', 'destination');
  }
  if (existsSync(target) && statSync(target).isDirectory()) {
    throw new ServiceError('invalid', 'destination: is a folder; name a file inside it, such as rigbook-backup.sqlite', 'destination');
  }
  try {
    const written = await backUpStore(raw, target, (done, total) => ctx.emit({ type: 'progress', kind: 'store', task: 'backup', done, total }));
    return { destination: written.path, bytes: written.bytes, at: ctx.now().toISOString() };
  } catch (error) {
    const code = (error as { code?: unknown }).code;
    if (typeof code === 'string' && WRITE_ERRORS.has(code)) {
      throw new ServiceError('invalid', `destination: the backup could not be written there (${(error as Error).message}). Nothing was written.`, 'destination');
    }
    throw error;
  }
});
