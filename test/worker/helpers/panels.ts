/** Example panels for API tests: a fictional two-colour experiment (no real lab, product or person). */

/** A small valid panel using most optional fields. */
export function examplePanel(): Record<string, unknown> {
  return {
    version: 1,
    title: 'Fictional tonsil section, two targets',
    excitation: [{ wavelengthNm: 405, powerRel: 1 }],
    probes: [
      {
        id: 'p1',
        label: 'CD-x',
        material: 'cdse',
        emissionPeakNm: 605,
        quantumYield: 0.6,
        abundance: 1,
        channel: 'c1',
      },
      { id: 'p2', label: 'nucleus', material: 'cdse', diameterNm: 3.2, sizeDispersionPct: 6, target: 'nuclei' },
    ],
    channels: [
      { id: 'c1', label: '605/20', filters: [{ type: 'bandpass', centerNm: 605, widthNm: 20 }], excitationNm: 405 },
      {
        id: 'c2',
        filters: [
          { type: 'longpass', edgeNm: 500, peakTransmission: 0.95 },
          { type: 'dichroic', edgeNm: 560, passes: 'below' },
          {
            type: 'table',
            points: [
              [500, 0.1],
              [520, 0.9],
              [560, 0.9],
              [580, 0.1],
            ],
          },
        ],
      },
    ],
    background: { level: 0.1 },
  };
}

/** The same panel with every object's keys in reverse order (the same panel to the API). */
export function reverseKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(reverseKeys);
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value as Record<string, unknown>)
        .reverse()
        .map(([k, v]) => [k, reverseKeys(v)]),
    );
  }
  return value;
}

/** Invented single-stain controls for examplePanel's channels (no panel in the body): two probes, an unstained row. */
export function exampleControls(): Record<string, unknown> {
  return {
    channels: ['c1', 'c2'],
    unstained: [10, 12],
    controls: [
      { probe: 'p1', values: [605, 40] },
      { probe: 'p2', values: [30, 400] },
    ],
  };
}
