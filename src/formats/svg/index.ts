// The SVG answers: each endpoint's plots stacked in one standalone document (see docs/formats.md).

import type { PotentialTerm } from '../../solver/central/potential.js';
import type { CentralForceAnalysis } from '../../solver/central/radial.js';
import { stackPanels } from './common.js';
import { axisUnits, effectivePotentialPanel, PLOT_WIDTH, type EffectivePotentialOptions } from './effective-potential.js';
import { eclipseTimelinePanel, type EclipseTimelineInput } from './eclipse-timeline.js';
import { groundTrackPanel, type GroundSample, type GroundTrackOptions } from './ground-track.js';
import { orbitPlanePanel, type OrbitPlaneInput } from './orbit-plane.js';
import { passTimelinePanel, type TimelinePass } from './pass-timeline.js';
import { radialOrbitPanel, type RadialOrbitInput } from './radial-orbit.js';
import { skyPlotPanel, type SkyPass, type SkyStation } from './sky-plot.js';

export { SVG_MEDIA_TYPE, formatTick, formatValue } from './common.js';

/** /v1/central-force: the effective potential, and the path r(phi) when a track was asked. */
export function centralForceSvg(terms: readonly PotentialTerm[], analysis: CentralForceAnalysis, track: RadialOrbitInput | null, opts: EffectivePotentialOptions = {}): string {
  const panels = [effectivePotentialPanel(terms, analysis, opts)];
  if (track) panels.push(radialOrbitPanel(track, { radiusUnit: axisUnits(opts.units).radius }));
  return stackPanels(PLOT_WIDTH, opts.title ?? 'Effective potential', panels);
}

/** /v1/orbit: the orbit in its plane. */
export const orbitSvg = (o: OrbitPlaneInput): string => stackPanels(PLOT_WIDTH, `Orbit about ${o.bodyName}`, [orbitPlanePanel(o)]);

/** /v1/track (Earth): the ground track on a world map. */
export const groundTrackSvg = (samples: readonly GroundSample[], opts: GroundTrackOptions): string =>
  stackPanels(PLOT_WIDTH, `Ground track of ${opts.name}`, [groundTrackPanel(samples, opts)]);

/** /v1/passes: the timeline of the window, then a sky plot per station. */
export function passesSvg(window: { start: string; stop: string }, stations: readonly SkyStation[], passes: readonly (SkyPass & TimelinePass)[]): string {
  return stackPanels(PLOT_WIDTH, 'Ground-station passes', [
    passTimelinePanel(window, stations.map((s) => s.id), passes),
    ...stations.map((s) => skyPlotPanel(s, passes.filter((p) => p.station === s.id))),
  ]);
}

/** /v1/eclipses: the timeline of sun and shadow, one row per UTC day. */
export const eclipsesSvg = (input: EclipseTimelineInput): string => stackPanels(PLOT_WIDTH, 'Eclipses', [eclipseTimelinePanel(input)]);
