import * as v from 'valibot';
import { existsSync, statSync } from 'node:fs';
import { dirname, isAbsolute, resolve } from 'node:path';
import { backUpStore, StoreFileClash } from '../../store/backup';
import { storeFileClash } from '../../store/file-identity';
import { describeStorageError } from '../../store/storage-errors';
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

const WRITE_ERRORS = new Set(['ENOENT', 'EISDIR', 'ENOTDIR', 'SQLITE_CANTOPEN']);

/**
 * A consistent copy of the open store (SQLite's online backup: writes may go on meanwhile).
 * The desktop shell's File › Back up… calls this with the file the person chose in the shell's
 * own save dialog; the page cannot name a destination (see service/page-call-policy.ts).
 */
export const backupStoreHandler = defineHandler(record({ destination: destination() }), async (ctx, input) => {
  const raw = ctx.raw;
  if (!raw) {
    if (ctx.engine === 'postgres') {
      throw new ServiceError('invalid', "destination: this store is a PostgreSQL database, not a file Rigbook can copy; back it up with the server's own pg_dump", 'destination');
    }
    throw new ServiceError('invalid', 'destination: this store is not a file that can be copied', 'destination');
  }
  const target = resolve(input.destination);
  // By identity, not by spelling: a symlinked folder, a hard link or another letter case can name the store.
  const clash = storeFileClash(target, raw.name);
  if (clash) throw new ServiceError('invalid', `destination: ${clash}; choose another file for the backup`, 'destination');
  if (existsSync(target) && statSync(target).isDirectory()) {
    throw new ServiceError('invalid', 'destination: is a folder; name a file inside it, such as rigbook-backup.sqlite', 'destination');
  }
  try {
    const written = await backUpStore(raw, target, (done, total) => ctx.emit({ type: 'progress', kind: 'store', task: 'backup', done, total }));
    return { destination: written.path, bytes: written.bytes, at: ctx.now().toISOString() };
  } catch (error) {
    if (error instanceof StoreFileClash) throw new ServiceError('invalid', `destination: ${error.message}`, 'destination');
    const storage = describeStorageError(error, dirname(target));
    if (storage && storage.problem !== 'in-use') {
      process.stderr.write(`backup to ${target}: ${storage.code}: ${(error as Error).message}\n`);
      throw new ServiceError(
        storage.problem,
        `destination: the backup could not be written there: ${storage.problem === 'disk-full' ? `the disk holding ${dirname(target)} is full` : `${dirname(target)} cannot be written (read-only, or another user's)`}. Nothing was written.`,
        'destination',
      );
    }
    const code = (error as { code?: unknown }).code;
    if (typeof code === 'string' && WRITE_ERRORS.has(code)) {
      throw new ServiceError('invalid', `destination: the backup could not be written there (${(error as Error).message}). Nothing was written.`, 'destination');
    }
    throw error;
  }
});
