// Designing around what a user already owns: targets locked to owned probes and channels, in catalog and free mode,
// and the answers to locks that cannot be kept. Scenarios are fictional (imagined markers, no real lab or product).
import { describe, expect, it } from 'vitest';
import { SpectraError, runDesign, type ChannelSpec, type DesignRequest, type ProbeSpec } from '../../../spectra/index';

const line405 = [{ wavelengthNm: 405 }];
const bandpass = (id: string, centerNm: number, widthNm: number): ChannelSpec => ({
  id,
  filters: [{ type: 'bandpass', centerNm, widthNm, edgeWidthNm: 2 }],
});
const dot = (id: string, material: ProbeSpec['material'], emissionPeakNm: number): ProbeSpec => ({
  id,
  material,
  emissionPeakNm,
});

const candidates = {
  probes: [dot('a525', 'cdse', 525), dot('a565', 'cdse', 565), dot('a605', 'cdse', 605), dot('i655', 'inp', 655)],
  channels: [
    bandpass('f525', 525, 30),
    bandpass('f565', 565, 30),
    bandpass('f605', 605, 30),
    bandpass('f655', 655, 30),
  ],
};

function errorOf(request: DesignRequest): SpectraError {
  try {
    runDesign(request);
  } catch (err) {
    if (err instanceof SpectraError) return err;
    throw err;
  }
  throw new Error('no error');
}

describe('locks', () => {
  it('catalog mode gives a locked target its probe and channel and designs the others around them', () => {
    const result = runDesign({
      targets: [
        { name: 'membrane', abundance: 'high' },
        { name: 'rare nuclear', abundance: 'low', lock: { probe: 'a565', channel: 'f565' } },
        { name: 'cytoplasm', abundance: 'medium' },
      ],
      excitation: line405,
      candidates,
    });
    const locked = result.panel!.probes.find((p) => p.target === 'rare nuclear')!;
    expect(locked.id).toBe('a565');
    expect(locked.channel).toBe('f565');
    expect(result.exact).toBe(true);
    const others = result.panel!.probes.filter((p) => p.target !== 'rare nuclear');
    expect(others.every((p) => p.id !== 'a565' && p.channel !== 'f565')).toBe(true);
  });

  it('free mode reads an owned probe in an owned channel when a target is locked to both', () => {
    const result = runDesign({
      targets: [
        { name: 'membrane', abundance: 'high' },
        { name: 'rare nuclear', abundance: 'low', lock: { probe: 'mine', channel: 'my-filter' } },
      ],
      excitation: line405,
      windowNm: [480, 720],
      owned: { probes: [dot('mine', 'cdse', 610)], channels: [bandpass('my-filter', 610, 20)] },
    });
    const locked = result.panel!.probes.find((p) => p.target === 'rare nuclear')!;
    expect(locked.id).toBe('mine');
    expect(locked.emissionPeakNm).toBe(610);
    expect(result.panel!.channels.find((c) => c.id === locked.channel)).toEqual(bandpass('my-filter', 610, 20));
    expect(new Set(result.panel!.probes.map((p) => p.id)).size).toBe(2);
  });

  it('free mode with channel choices proposes only those channels', () => {
    const choices = [bandpass('cam-a', 525, 40), bandpass('cam-b', 605, 40), bandpass('cam-c', 700, 50)];
    const result = runDesign({
      targets: [
        { name: 'membrane', abundance: 'high' },
        { name: 'rare nuclear', abundance: 'low' },
      ],
      excitation: line405,
      channelChoices: choices,
    });
    expect(result.panel!.channels.every((c) => choices.some((x) => x.id === c.id))).toBe(true);
  });

  it('two targets locked to one probe are refused, naming the second lock', () => {
    const err = errorOf({
      targets: [
        { name: 'membrane', abundance: 'high', lock: { probe: 'a525' } },
        { name: 'rare nuclear', abundance: 'low', lock: { probe: 'a525' } },
      ],
      excitation: line405,
      candidates,
    });
    expect(err.path).toEqual(['targets', 1, 'lock', 'probe']);
    expect(err.message).toContain("'membrane' and 'rare nuclear' are both locked to probe 'a525'");
  });

  it('a lock on an unknown id is refused, naming the field', () => {
    const err = errorOf({
      targets: [{ name: 'membrane', abundance: 'high', lock: { channel: 'nowhere' } }],
      excitation: line405,
      candidates,
    });
    expect(err.path).toEqual(['targets', 0, 'lock', 'channel']);
  });

  it('a lock on an owned probe emitting 10 nm from the line is no_usable_panel, saying which check it fails', () => {
    const result = runDesign({
      targets: [
        { name: 'membrane', abundance: 'high' },
        { name: 'rare nuclear', abundance: 'low', lock: { probe: 'near-line' } },
      ],
      excitation: [{ wavelengthNm: 488 }],
      owned: { probes: [dot('near-line', 'cdse', 498)] },
    });
    expect(result.verdict).toBe('no_usable_panel');
    expect(result.panel).toBeNull();
    expect(result.verdictReason).toContain(
      "locked to probe 'near-line', which emits within 15 nm of an excitation line",
    );
  });

  it('a lock on an owned 420/20 channel next to a 405 nm line is no_usable_panel: it does not block the line', () => {
    const result = runDesign({
      targets: [
        { name: 'membrane', abundance: 'high' },
        { name: 'rare nuclear', abundance: 'low', lock: { channel: 'leaky' } },
      ],
      excitation: line405,
      owned: { channels: [bandpass('leaky', 420, 20)] },
    });
    expect(result.verdict).toBe('no_usable_panel');
    expect(result.verdictReason).toContain("locked to channel 'leaky', which does not block every line");
  });

  it('channel choices with candidates are refused: catalog mode has its own channels', () => {
    const err = errorOf({
      targets: [{ name: 'membrane', abundance: 'high' }],
      excitation: line405,
      candidates,
      channelChoices: [bandpass('cam-a', 525, 40)],
    });
    expect(err.path).toEqual(['channelChoices']);
  });
});
