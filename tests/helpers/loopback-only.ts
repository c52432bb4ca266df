import { isIPv4, isIPv6 } from 'node:net';

// Tests and benchmarks send traffic to 127.0.0.0/8 and ::1 only, even where another address
// belongs to this machine: a build machine's other addresses are on someone's network.

/** True for a literal address in 127.0.0.0/8 (RFC 1122 §3.2.1.3) or ::1 (RFC 4291 §2.5.3); names are not resolved. */
export function isLoopbackAddress(address: string): boolean {
  if (isIPv4(address)) return address.split('.')[0] === '127';
  if (isIPv6(address)) {
    const lower = address.toLowerCase();
    if (lower === '::1' || lower === '0:0:0:0:0:0:0:1') return true;
    // An IPv4-mapped loopback address reaches 127.0.0.0/8 as well.
    const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/.exec(lower)?.[1];
    return mapped !== undefined && isIPv4(mapped) && mapped.split('.')[0] === '127';
  }
  return false;
}

/** Throws before any socket is opened when a test aims outside the loopback range. */
export function assertLoopbackTarget(address: string): string {
  if (!isLoopbackAddress(address)) throw new Error(`Tests connect to 127.0.0.0/8 and ::1 only; "${address}" is outside that range.`);
  return address;
}
