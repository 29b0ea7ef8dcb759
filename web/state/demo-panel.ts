/**
 * The bundled demo: an invented six-target panel for a fixed tissue section under one violet 405 nm line. The targets
 * are generic and each probe is named for its target; the dots' peaks (515, 580, 620, 660 and 720 nm) are our own
 * picks, not a commercial series; the nuclear counterstain is DAPI from the dye library.
 */
import type { PanelSpec } from '../../spectra/index';

/**
 * The demo panel: five core/shell dots (as sold: CdSe/ZnS, InP/ZnS, CdTe/CdS) and a DAPI counterstain, six bandpass
 * channels, sample background on.
 */
export function demoPanel(): PanelSpec {
  return {
    version: 1,
    title: 'Demo: six targets on a tissue section, one 405 nm line',
    excitation: [{ wavelengthNm: 405, powerRel: 1 }],
    probes: [
      {
        id: 'p1',
        label: 'Nuclear stain',
        material: 'dye',
        dye: 'dapi',
        target: 'nuclear DNA counterstain',
        abundance: 1,
      },
      {
        id: 'p2',
        label: 'Envelope dot',
        material: 'cdse',
        emissionPeakNm: 515,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
        sizeDispersionPct: 5,
        quantumYield: 0.5,
        target: 'nuclear envelope marker',
        abundance: 1,
      },
      {
        id: 'p3',
        label: 'Mito dot',
        material: 'inp',
        emissionPeakNm: 580,
        shell: [{ material: 'zns', thicknessNm: 0.4 }],
        quantumYield: 0.5,
        target: 'mitochondrial marker',
        abundance: 1,
      },
      {
        id: 'p4',
        label: 'Actin dot',
        material: 'cdse',
        emissionPeakNm: 620,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
        sizeDispersionPct: 5,
        quantumYield: 0.5,
        target: 'cytoskeleton marker',
        abundance: 1,
      },
      {
        id: 'p5',
        label: 'Vessel dot',
        material: 'cdse',
        emissionPeakNm: 660,
        shell: [{ material: 'zns', thicknessNm: 0.9 }],
        sizeDispersionPct: 6,
        quantumYield: 0.5,
        target: 'vessel wall marker (sparse)',
        abundance: 0.2,
      },
      {
        id: 'p6',
        label: 'Membrane dot',
        material: 'cdte',
        emissionPeakNm: 720,
        shell: [{ material: 'cds', thicknessNm: 0.7 }],
        quantumYield: 0.4,
        target: 'membrane marker',
        abundance: 1,
      },
    ],
    channels: [
      { id: 'c1', label: 'Blue', filters: [{ type: 'bandpass', centerNm: 460, widthNm: 40 }], excitationNm: 405 },
      { id: 'c2', label: 'Green', filters: [{ type: 'bandpass', centerNm: 515, widthNm: 20 }], excitationNm: 405 },
      { id: 'c3', label: 'Yellow', filters: [{ type: 'bandpass', centerNm: 580, widthNm: 20 }], excitationNm: 405 },
      { id: 'c4', label: 'Orange', filters: [{ type: 'bandpass', centerNm: 620, widthNm: 20 }], excitationNm: 405 },
      { id: 'c5', label: 'Red', filters: [{ type: 'bandpass', centerNm: 660, widthNm: 20 }], excitationNm: 405 },
      { id: 'c6', label: 'Far red', filters: [{ type: 'longpass', edgeNm: 700 }], excitationNm: 405 },
    ],
    background: { level: 0.1 },
  };
}

/**
 * The demo scenario's lot of the Mito dot (invented): in the Orange channel it gives 15 % of its brightest channel's
 * signal more than the model predicts. The demo controls (scripts/make-demo-controls.mts) and the demo pilot image
 * (scripts/make-pilot-image.mts) are both made with it, so the controls flag it and their measured columns fit the
 * image better than the modelled ones.
 */
export const DEMO_LOT_DEVIATION = { probe: 'p3', channel: 'c4', fractionOfBrightest: 0.15 } as const;

/** The demo sample's true collected signal [channel][probe]: the panel's model with DEMO_LOT_DEVIATION added. */
export function demoLotCollected(panel: PanelSpec, collected: readonly (readonly number[])[]): number[][] {
  const p = panel.probes.findIndex((probe) => probe.id === DEMO_LOT_DEVIATION.probe);
  const c = panel.channels.findIndex((channel) => channel.id === DEMO_LOT_DEVIATION.channel);
  const brightest = Math.max(...collected.map((row) => row[p]));
  return collected.map((row, ci) =>
    row.map((v, pi) => (ci === c && pi === p ? v + DEMO_LOT_DEVIATION.fractionOfBrightest * brightest : v)),
  );
}
