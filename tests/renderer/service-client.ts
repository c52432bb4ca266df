import { createClient, type Client } from '../../src-renderer/lib/api/client';
import { serviceFixture, type ServiceFixture } from '../helpers/service-fixture';

/** The renderer's own client over the real handler map on a real SQLite file; only the wire is skipped. */
export async function clientOnService(): Promise<{ f: ServiceFixture; client: Client }> {
  const f = await serviceFixture();
  const client = createClient({
    kind: 'browser',
    call: (name, args) => f.host.call(name, args),
    onEvent: (listener) => f.host.subscribe(listener),
  });
  return { f, client };
}

export const settle = (ms = 300) => new Promise((r) => setTimeout(r, ms));
