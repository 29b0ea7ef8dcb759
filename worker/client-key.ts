/**
 * Client keys for per-client budgets: the address a request comes from, read in full (IPv4 dotted quads; IPv6 in
 * every spelling RFC 4291 §2.2 allows: `::`, any case, leading zeros, an embedded IPv4 tail; a zone id after `%`,
 * RFC 4007 §11, is dropped) and reduced to the part one subscriber holds: an IPv4 address whole, an IPv6 address
 * cut to its /64 (RFC 4291 §2.5.4: the interface identifier is the low 64 bits, so one subscriber can rotate through a
 * whole /64). An IPv4-mapped IPv6 address (`::ffff:a.b.c.d`, RFC 4291 §2.5.5.2) is the IPv4 address it carries.
 * Pure: no Workers, HTTP or zod, so it is tested in the unit project.
 */

/** The key of a request without a client address (another worker calling through a service binding). */
export const NO_CLIENT_KEY = 'no-client-ip';

/**
 * The one key every unparsable address shares (our convention): conservative, since all such clients then spend one
 * budget together. On Workers the platform writes CF-Connecting-IP, so this should not occur there.
 */
export const UNPARSABLE_CLIENT_KEY = 'unparsable-client-ip';

/** Groups of 16 bits in an IPv6 address (RFC 4291 §2.2). */
const IPV6_GROUPS = 8;
/** Groups kept in an IPv6 key: 4 × 16 bits = the /64 prefix. */
const IPV6_KEY_GROUPS = 4;
/** A hex group: 1 to 4 hex digits, leading zeros allowed (RFC 4291 §2.2). */
const HEX_GROUP = /^[0-9a-f]{1,4}$/;
/** A dotted-quad part: 0 to 255 in decimal without leading zeros (RFC 6943 §3.1.1, strict form). */
const DECIMAL_OCTET = /^(0|[1-9][0-9]{0,2})$/;
/** The 16-bit value of the mapped-IPv4 marker group (::ffff:0:0/96, RFC 4291 §2.5.5.2). */
const MAPPED_MARKER = 0xffff;

/** The four octets of a dotted-quad IPv4 address, or null when `text` is not one. */
export function parseIpv4(text: string): number[] | null {
  const parts = text.split('.');
  if (parts.length !== 4 || !parts.every((p) => DECIMAL_OCTET.test(p))) return null;
  const octets = parts.map(Number);
  return octets.every((o) => o <= 255) ? octets : null;
}

/** Hex groups of one side of `::` (an IPv4 tail allowed on the last side) as 16-bit values, or null. */
function parseGroups(text: string, ipv4TailAllowed: boolean): number[] | null {
  if (text === '') return [];
  const parts = text.split(':');
  const groups: number[] = [];
  for (const [i, part] of parts.entries()) {
    const isLast = i === parts.length - 1;
    if (HEX_GROUP.test(part)) groups.push(parseInt(part, 16));
    else if (isLast && ipv4TailAllowed && parseIpv4(part) !== null) {
      const [a, b, c, d] = parseIpv4(part)!;
      groups.push((a << 8) | b, (c << 8) | d);
    } else return null;
  }
  return groups;
}

/**
 * The eight 16-bit groups of an IPv6 address in any RFC 4291 spelling (case-insensitive; a zone id after `%` is
 * dropped), or null when `text` is not one.
 */
export function parseIpv6(text: string): number[] | null {
  const address = text.toLowerCase().split('%')[0];
  const halves = address.split('::');
  if (halves.length > 2) return null;
  if (halves.length === 1) {
    const groups = parseGroups(address, true);
    return groups !== null && groups.length === IPV6_GROUPS ? groups : null;
  }
  const head = parseGroups(halves[0], false);
  const tail = parseGroups(halves[1], true);
  if (head === null || tail === null) return null;
  const missing = IPV6_GROUPS - head.length - tail.length;
  // `::` stands for at least one zero group (RFC 4291 §2.2, item 2).
  if (missing < 1) return null;
  return [...head, ...new Array<number>(missing).fill(0), ...tail];
}

/** The IPv4 octets an IPv4-mapped IPv6 address carries (::ffff:a.b.c.d, in any spelling), or null. */
function mappedIpv4(groups: number[]): number[] | null {
  const prefixIsMapped = groups.slice(0, 5).every((g) => g === 0) && groups[5] === MAPPED_MARKER;
  if (!prefixIsMapped) return null;
  return [groups[6] >> 8, groups[6] & 0xff, groups[7] >> 8, groups[7] & 0xff];
}

/** A client address read in full: an IPv4 address (four octets) or an IPv6 address (eight groups). */
export type ClientAddress = { kind: 'ipv4'; octets: number[] } | { kind: 'ipv6'; groups: number[] };

/** The address in `text` (brackets around an IPv6 address allowed), IPv4-mapped IPv6 read as IPv4; null if none. */
export function parseClientAddress(text: string): ClientAddress | null {
  const trimmed = text.trim().replace(/^\[(.*)\]$/, '$1');
  const octets = parseIpv4(trimmed);
  if (octets !== null) return { kind: 'ipv4', octets };
  const groups = parseIpv6(trimmed);
  if (groups === null) return null;
  const mapped = mappedIpv4(groups);
  return mapped !== null ? { kind: 'ipv4', octets: mapped } : { kind: 'ipv6', groups };
}

/** True for loopback addresses: 127.0.0.0/8 (RFC 1122 §3.2.1.3) and ::1 (RFC 4291 §2.5.3). */
export function isLoopback(address: ClientAddress): boolean {
  if (address.kind === 'ipv4') return address.octets[0] === 127;
  return address.groups.slice(0, 7).every((g) => g === 0) && address.groups[7] === 1;
}

/**
 * The budget key of a client address: `a.b.c.d` for IPv4 (mapped IPv6 included), `g0:g1:g2:g3::/64` (lower-case
 * hex, no leading zeros) for IPv6, so every spelling of one /64 gives one key; {@link NO_CLIENT_KEY} when there is no
 * address, {@link UNPARSABLE_CLIENT_KEY} when it cannot be read, and null for loopback (local runs, not limited).
 */
export function clientKey(clientIp: string | undefined): string | null {
  if (clientIp === undefined || clientIp.trim() === '') return NO_CLIENT_KEY;
  const address = parseClientAddress(clientIp);
  if (address === null) return UNPARSABLE_CLIENT_KEY;
  if (isLoopback(address)) return null;
  if (address.kind === 'ipv4') return address.octets.join('.');
  return `${address.groups
    .slice(0, IPV6_KEY_GROUPS)
    .map((g) => g.toString(16))
    .join(':')}::/64`;
}
