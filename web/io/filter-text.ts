/**
 * Plain description of a filter as one writes it on an order, e.g. "bandpass 605/20" (centre/FWHM in nm).
 */
import type { ChannelSpec, FilterSpec } from '../../spectra/index';

const nm = (v: number) => String(Math.round(v * 10) / 10);

/**
 * "bandpass 605/20", "longpass 650", "shortpass 550", "dichroic 560 (passes above)",
 * "measured table, 41 points 500–700 nm".
 */
export function describeFilter(filter: FilterSpec): string {
  switch (filter.type) {
    case 'bandpass':
      return `bandpass ${nm(filter.centerNm)}/${nm(filter.widthNm)}`;
    case 'longpass':
    case 'shortpass':
      return `${filter.type} ${nm(filter.edgeNm)}`;
    case 'dichroic':
      return `dichroic ${nm(filter.edgeNm)} (passes ${filter.passes})`;
    case 'table': {
      const p = filter.points;
      return p.length === 0
        ? 'measured table, empty'
        : `measured table, ${p.length} points ${nm(p[0][0])}–${nm(p[p.length - 1][0])} nm`;
    }
  }
}

/** Every filter of a channel, in light-path order, joined with " + ". */
export function describeChannel(channel: ChannelSpec): string {
  return channel.filters.length === 0 ? 'no filter' : channel.filters.map(describeFilter).join(' + ');
}

/** The excitation lines on while a channel is read, as text ("405 nm", "405 + 488 nm", "all lines"). */
export function describeChannelExcitation(channel: ChannelSpec): string {
  const ex = channel.excitationNm;
  if (ex === undefined) return 'all lines';
  const list = Array.isArray(ex) ? ex : [ex];
  return `${list.join(' + ')} nm`;
}
