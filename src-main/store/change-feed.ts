import pg from 'pg';
import { withoutSecret } from './store-location';
import { poolConfig } from './open-postgres';

// Several benches on one PostgreSQL store see each other's changes through the server's
// LISTEN/NOTIFY: each process announces what it committed on one channel, and every other
// process listening there passes the announcement on to its own subscribers, as if the change
// had been made locally. A SQLite store has one writer process at a time and needs none of this.

/**
 * The channel of one store. Channels are per database, and a database may hold several stores,
 * one per schema (chosen with `search_path` in the URL's `options`), so the schema is part of it.
 */
export function changeChannel(schema: string): string {
  return `rigbook_changes:${schema}`;
}

/**
 * The server refuses a payload of 8000 bytes or more; a message with a long id list is split
 * into several, each under this size.
 */
export const MAX_PAYLOAD_BYTES = 7000;

export interface ChangeMessage {
  /** The process that made the change: it has told its own subscribers already. */
  origin: string;
  event: { type: 'verdicts-changed'; buildIds: string[] } | { type: 'records-changed'; kind: string; ids: string[] };
}

/** One change as one or more payloads, each under the server's limit, none losing an id. */
export function changePayloads(message: ChangeMessage): string[] {
  const { event } = message;
  const ids = event.type === 'verdicts-changed' ? event.buildIds : event.ids;
  const withIds = (part: string[]): ChangeMessage => ({ origin: message.origin, event: event.type === 'verdicts-changed' ? { type: event.type, buildIds: part } : { ...event, ids: part } });
  const out: string[] = [];
  let part: string[] = [];
  const emptySize = Buffer.byteLength(JSON.stringify(withIds([])));
  let size = emptySize;
  for (const id of ids) {
    const idSize = Buffer.byteLength(JSON.stringify(id)) + 1;
    if (part.length > 0 && size + idSize > MAX_PAYLOAD_BYTES) {
      out.push(JSON.stringify(withIds(part)));
      part = [];
      size = emptySize;
    }
    part.push(id);
    size += idSize;
  }
  if (part.length > 0 || out.length === 0) out.push(JSON.stringify(withIds(part)));
  return out;
}

/** Reads a payload; null for anything that is not a change message (another program on the channel). */
export function readChangePayload(payload: string | undefined): ChangeMessage | null {
  if (payload === undefined) return null;
  try {
    const parsed = JSON.parse(payload) as Partial<ChangeMessage> | null;
    const event = parsed?.event;
    if (typeof parsed?.origin !== 'string' || !event) return null;
    const strings = (list: unknown): list is string[] => Array.isArray(list) && list.every((x) => typeof x === 'string');
    if (event.type === 'verdicts-changed' && strings(event.buildIds)) return { origin: parsed.origin, event: { type: event.type, buildIds: event.buildIds } };
    if (event.type === 'records-changed' && typeof event.kind === 'string' && strings(event.ids)) return { origin: parsed.origin, event: { type: event.type, kind: event.kind, ids: event.ids } };
    return null;
  } catch {
    return null;
  }
}

export interface ChangeFeed {
  /** Announces a committed change to the other processes; a failure is logged, never thrown. */
  publish: (message: ChangeMessage) => Promise<void>;
  close: () => Promise<void>;
}

const RECONNECT_MS = 1000;

/**
 * Listens on the store's channel with a connection of its own (a pooled one would be handed to
 * queries and lose the LISTEN), reconnecting after a lost connection, and publishes over another.
 */
export async function openChangeFeed(url: string, schema: string, origin: string, onChange: (message: ChangeMessage) => void): Promise<ChangeFeed> {
  const channel = changeChannel(schema);
  const log = (text: string) => process.stderr.write(`Rigbook: ${withoutSecret(text, url)}\n`);
  const config = poolConfig(url, 1);
  const publisher = new pg.Pool(config);
  publisher.on('error', (error) => log(`the change announcements lost their connection: ${error.message}`));
  let closed = false;
  let listener: pg.Client | null = null;
  let retry: ReturnType<typeof setTimeout> | null = null;

  const connect = async (): Promise<void> => {
    const client = new pg.Client(config);
    client.on('notification', (note) => {
      if (note.channel !== channel) return;
      const message = readChangePayload(note.payload);
      if (message && message.origin !== origin) onChange(message);
    });
    client.on('error', (error) => {
      log(`changes from other benches are not arriving (${error.message}); reconnecting`);
      void client.end().catch(() => {});
      if (listener === client) listener = null;
      schedule();
    });
    await client.connect();
    await client.query(`listen ${client.escapeIdentifier(channel)}`);
    if (closed) {
      await client.end();
      return;
    }
    listener = client;
  };
  const schedule = () => {
    if (closed || retry !== null) return;
    retry = setTimeout(() => {
      retry = null;
      connect().catch((error: unknown) => {
        log(`changes from other benches are not arriving (${error instanceof Error ? error.message : String(error)}); trying again`);
        schedule();
      });
    }, RECONNECT_MS);
    retry.unref?.();
  };
  await connect();

  // One after another, in the order the changes were made; closing waits for the last.
  let sent: Promise<void> = Promise.resolve();
  const send = async (message: ChangeMessage) => {
    try {
      for (const payload of changePayloads(message)) await publisher.query('select pg_notify($1, $2)', [channel, payload]);
    } catch (error) {
      log(`a change was saved but not announced to the other benches: ${error instanceof Error ? error.message : String(error)}`);
    }
  };
  return {
    publish: (message) => {
      if (closed) return sent;
      sent = sent.then(() => send(message));
      return sent;
    },
    close: async () => {
      await sent;
      closed = true;
      if (retry !== null) clearTimeout(retry);
      const client = listener;
      listener = null;
      await Promise.allSettled([client?.end(), publisher.end()]);
    },
  };
}
