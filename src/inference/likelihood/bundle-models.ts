import { InputError } from '../../contracts/input-error.js';
import type { LinearSpectrum } from '../../contracts/linear-spectrum.js';
import type { StatisticModel } from '../../contracts/statistic-model.js';
import { TreeBispectrumModel, type BinAveragingMethod } from '../../bispectrum/tree-bispectrum-model.js';
import type { MeasurementBundle } from '../../data/measurement-bundle.js';
import { firstCentre, triangleBinsOf } from '../../data/statistic-table.js';
import type { PowerBinAveraging } from '../../power/bin-sampling.js';
import { PowerMultipoleModel } from '../../power/power-multipole-model.js';
import type { ModelsForSpectrum } from './model-source.js';

/**
 * The power-multipole and tree-level bispectrum models on a bundle's own bins
 * (JSON-serialisable settings). The P table must list consecutive k bins; the
 * bispectrum model is built on exactly the bundle's triangle bins.
 */
export interface BundleModelOptions {
  readonly power?: { readonly averaging?: PowerBinAveraging; readonly muNodes?: number };
  readonly bispectrum?: {
    readonly averaging?: BinAveragingMethod;
    readonly volumeOrder?: number;
    /** true (default): damping of each P at its own angle to the line of sight; "angle-averaged": its average over the angle. */
    readonly irResummation?: boolean | 'angle-averaged';
    readonly velocityDispersion?: number;
    /** Cache folder of discrete-box averages (averaging "box" uses the bundle's boxSize). */
    readonly latticeCacheDir?: string;
  };
}

export function bundleModels(bundle: MeasurementBundle, options: BundleModelOptions = {}): ModelsForSpectrum {
  const { power, bispectrum, metadata } = bundle;
  if (power) {
    power.shells.forEach((s, i) => {
      if (s !== i) throw new InputError(`${power.file}: the power model needs consecutive k bins, but bin ${i + 1} is shell ${s} of the grid`, { where: power.file });
    });
  }
  const bins = bispectrum ? triangleBinsOf(bispectrum) : undefined;
  return (spectrum: LinearSpectrum) => {
    const models: StatisticModel[] = [];
    if (power) {
      models.push(
        new PowerMultipoleModel({
          spectrum,
          bins: { kMin: firstCentre(power), dk: power.dk, count: power.size },
          nbar: metadata.numberDensity,
          multipoles: power.multipoles,
          averaging: options.power?.averaging,
          muNodes: options.power?.muNodes,
        }),
      );
    }
    if (bispectrum && bins) {
      const b = options.bispectrum ?? {};
      models.push(
        new TreeBispectrumModel({
          spectrum,
          bins,
          multipoles: bispectrum.multipoles,
          numberDensity: metadata.numberDensity,
          averaging: b.averaging,
          volumeOrder: b.volumeOrder,
          irResummation: b.irResummation === undefined ? undefined : b.irResummation !== false,
          irAngleAveraged: b.irResummation === 'angle-averaged',
          velocityDispersion: b.velocityDispersion,
          boxSize: metadata.boxSize,
          latticeCacheDir: b.latticeCacheDir,
        }),
      );
    }
    return models;
  };
}
