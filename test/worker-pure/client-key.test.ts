// Client keys of the share budget: every spelling of one address or /64 gives one key. Addresses are from the
// documentation ranges (2001:db8::/32, RFC 3849; 192.0.2.0/24 and 198.51.100.0/24, RFC 5737), plus the NAT64 prefix
// 64:ff9b::/96 (RFC 6052).
import { describe, expect, it } from 'vitest';
import { clientKey, NO_CLIENT_KEY, parseIpv4, parseIpv6, UNPARSABLE_CLIENT_KEY } from '../../worker/client-key';

describe('parseIpv6', () => {
  it.each([
    ['2001:db8::1', [0x2001, 0xdb8, 0, 0, 0, 0, 0, 1]],
    ['2001:0DB8:0000:0000:0000:0000:0000:0001', [0x2001, 0xdb8, 0, 0, 0, 0, 0, 1]],
    ['::', [0, 0, 0, 0, 0, 0, 0, 0]],
    ['1::', [1, 0, 0, 0, 0, 0, 0, 0]],
    ['64:ff9b::1.2.3.4', [0x64, 0xff9b, 0, 0, 0, 0, 0x0102, 0x0304]],
    ['0:0:0:0:0:ffff:192.0.2.1', [0, 0, 0, 0, 0, 0xffff, 0xc000, 0x0201]],
    ['fe80::1%eth0', [0xfe80, 0, 0, 0, 0, 0, 0, 1]],
    ['1:2:3:4:5:6:7::', [1, 2, 3, 4, 5, 6, 7, 0]],
  ])('parseIpv6(%s) gives its eight 16-bit groups', (text, groups) => {
    expect(parseIpv6(text)).toEqual(groups);
  });

  it.each([
    '1:2:3:4:5:6:7:8:9',
    '1:2:3:4:5:6:7',
    '1::2::3',
    '1:::2',
    ':1:2:3:4:5:6:7',
    '12345::1',
    'g::1',
    '1.2.3.4::1',
    '::1.2.3.256',
    '1:2:3:4:5:6:7:8::',
    '',
  ])('parseIpv6(%j) is null: not an IPv6 address', (text) => {
    expect(parseIpv6(text)).toBeNull();
  });
});

describe('parseIpv4', () => {
  it('parseIpv4 reads a dotted quad and refuses out-of-range, short and leading-zero forms', () => {
    expect(parseIpv4('192.0.2.255')).toEqual([192, 0, 2, 255]);
    for (const bad of ['192.0.2.256', '192.0.2', '192.0.2.1.5', '192.0.02.1', '192.0.2.x', '']) {
      expect(parseIpv4(bad), bad).toBeNull();
    }
  });
});

describe('clientKey', () => {
  it('clientKey gives one key to one /64 written with ::, any case, leading zeros, zone id or IPv4 tail', () => {
    const spellings = [
      '2001:db8:a:b::1',
      '2001:DB8:A:B::1',
      '2001:0db8:000a:000b:0000:0000:0000:0001',
      '2001:db8:a:b:0:0:0:1',
      '2001:db8:a:b:ffff:ffff:ffff:ffff',
      '2001:db8:a:b::1%eth0',
      '2001:db8:a:b::192.0.2.1',
      '[2001:db8:a:b::2]',
      ' 2001:db8:a:b:1:: ',
    ];
    const keys = new Set(spellings.map(clientKey));
    expect([...keys]).toEqual(['2001:db8:a:b::/64']);
  });

  it('clientKey gives a key that cuts at the /64 even when the written text is short before its ::', () => {
    // The old key took the text before `::`, so these two addresses of different /64s got one key.
    expect(clientKey('2001:db8::1')).toBe('2001:db8:0:0::/64');
    expect(clientKey('2001:db8::1:0:0:1')).toBe('2001:db8:0:0::/64');
    expect(clientKey('2001:db8::1:0:0:0:1')).toBe('2001:db8:0:1::/64');
  });

  it('clientKey gives different keys to addresses in different /64s', () => {
    const addresses = ['2001:db8:a:b::1', '2001:db8:a:c::1', '2001:db8:b:b::1', '2001:db9:a:b::1', '2001:db8:a::1'];
    expect(new Set(addresses.map(clientKey)).size).toBe(addresses.length);
  });

  it('clientKey of an IPv4-mapped IPv6 address, dotted or hex, equals the key of the plain IPv4 address', () => {
    const plain = clientKey('1.2.3.4');
    expect(plain).toBe('1.2.3.4');
    for (const mapped of ['::ffff:1.2.3.4', '::FFFF:102:304', '0:0:0:0:0:ffff:0102:0304', '::ffff:0102:0304']) {
      expect(clientKey(mapped), mapped).toBe(plain);
    }
  });

  it('clientKey gives two IPv4-mapped clients two keys (the mapped prefix is not one /64 for all)', () => {
    expect(clientKey('::ffff:192.0.2.1')).toBe('192.0.2.1');
    expect(clientKey('::ffff:198.51.100.7')).toBe('198.51.100.7');
  });

  it('clientKey of a NAT64 address keys on its /64 like any IPv6 address', () => {
    expect(clientKey('64:ff9b::1.2.3.4')).toBe('64:ff9b:0:0::/64');
  });

  it('clientKey is null for loopback in every spelling, IPv4, IPv6 and mapped', () => {
    for (const loopback of ['127.0.0.1', '127.1.2.3', '::1', '0:0:0:0:0:0:0:1', '::ffff:127.0.0.1', '::ffff:7f00:1']) {
      expect(clientKey(loopback), loopback).toBeNull();
    }
  });

  it('clientKey gives every unparsable address one shared key, and a missing address its own key', () => {
    for (const bad of ['not an address', '1::2::3', '300.1.1.1', '2001:db8:::1', 'fe80::g']) {
      expect(clientKey(bad), bad).toBe(UNPARSABLE_CLIENT_KEY);
    }
    expect(clientKey(undefined)).toBe(NO_CLIENT_KEY);
    expect(clientKey('  ')).toBe(NO_CLIENT_KEY);
  });
});
