// What the service and the backups use of an open SQLite file, written out rather than
// imported: the handler map's declarations reach the page's compilation, and the driver's
// type package would bring every Node global with it. A better-sqlite3 Database fits it.

export interface SqliteFileHandle {
  /** The file's path as it was opened. */
  readonly name: string;
  /** SQLite's online backup: copies the live file while writes go on. */
  backup(destination: string, options?: { progress: (info: { totalPages: number; remainingPages: number }) => number }): Promise<unknown>;
}
