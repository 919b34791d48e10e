/**
 * Wheel–part contact along the cut, the removal rate and the cutting time.
 *
 * Depth x runs from where the wheel enters the part (x = 0) in the feed direction.
 * The section is the part's cross-section in the plane of the cut:
 * - round bar of diameter D: the wheel's edge meets the chord 2·√(x·(D − x));
 * - tube of outside diameter D and wall w: the outer chord minus the chord of the bore
 *   (bore diameter d = D − 2w) where the edge is inside the bore, x ∈ (w, D − w);
 * - rectangular section of height H and width W: W all the way down.
 * The edge is treated as straight across the section: the wheel radius is large next to
 * the part, so the true arc is only slightly longer than the chord.
 *
 * Models for the cut motions (marked: these are Kerfbook's models, common practice, not
 * measured values):
 * - straight plunge, pulsed plunge, stepped depth: the section chord at depth x.
 * - rocking: the part is tilted back and forth so the wheel works a shorter arc; modelled
 *   as ROCKING_CONTACT_FACTOR × the section chord.
 * - turning specimen: the part rotates, so the wheel works from the outside in to the
 *   centre (round bar) or through the wall (tube). Per unit of radial feed it removes the
 *   whole ring at the current radius r = D/2 − x, so the length figure is an effective
 *   removal length per turn, the circumference 2π·r — not a contact arc: the arc the
 *   wheel touches at any moment is far shorter and depends on how fast the part turns.
 *   The removal rate follows from conservation of volume. A rectangular section is
 *   treated as a plunge.
 * - traverse pass: the wheel crosses the part in shallow passes of depth a = H / passes;
 *   the geometric contact length of a shallow pass is l = √(a·D_wheel) (the grinding
 *   textbook formula, e.g. Malkin & Guo, Grinding Technology, 2nd ed. — from memory)
 *   and the removal rate is feed × wheel thickness × a.
 */
import type { ContactMeasure, CutMotion, Shape } from './vocabulary';

/** Share of the section chord a rocking cut works at once (Kerfbook's model, common practice). */
export const ROCKING_CONTACT_FACTOR = 0.5;

/** Number of depths sampled for the plot unless told otherwise. */
export const PROFILE_SAMPLES = 41;
/** Most depths a profile samples: a huge or non-finite count must not exhaust memory. */
export const PROFILE_SAMPLES_MAX = 100_000;

/** The part's cross-section in the plane of the cut. */
export interface CutSection {
  shape: Shape;
  /** Depth the wheel cuts through: outside diameter (round bar, tube) or section height (rectangular), mm. */
  sizeMm: number;
  /** Width of a rectangular section along the wheel's edge, mm (null otherwise). */
  widthMm: number | null;
  /** Wall thickness of a tube, mm (null otherwise). */
  wallMm: number | null;
}

/** How the cut is made. */
export interface CutSetup {
  motion: CutMotion;
  /** Feed speed, mm/s (for a traverse pass: the crossing speed). */
  feedMmS: number;
  /** Slower feed for the first `entryLengthMm`, mm/s, or null. */
  entryFeedMmS: number | null;
  /** Length of travel at the entry feed, mm, or null. */
  entryLengthMm: number | null;
  /** Passes of a traverse or stepped cut; null = 1. */
  passes: number | null;
  /** Wheel thickness (the kerf width), mm. */
  wheelThicknessMm: number;
  /** Wheel diameter, mm (used by the traverse-pass contact length). */
  wheelDiameterMm: number;
}

/** One sample of the contact profile. */
export interface ContactPoint {
  /** Depth from the entry point, mm. */
  depthMm: number;
  /** Contact length at that depth, mm (for a turning specimen: the effective removal length per turn 2π·r, see contactMeasureOf). */
  contactMm: number;
  /** Removal rate at that depth, mm³/s. */
  removalMm3S: number;
}

/** Chord of a circle of diameter `d` (mm) at depth `x` (mm) from its edge; 0 outside the circle. */
export function circleChordMm(d: number, x: number): number {
  if (x <= 0 || x >= d) return 0;
  return 2 * Math.sqrt(x * (d - x));
}

/** Length of material (mm) along the wheel's edge at depth `x` (mm) through the section. */
export function sectionChordMm(section: CutSection, x: number): number {
  const { shape, sizeMm: size } = section;
  if (x < 0 || x > size) return 0;
  switch (shape) {
    case 'round-bar':
      return circleChordMm(size, x);
    case 'rectangular':
      return section.widthMm ?? 0;
    case 'tube': {
      const wall = Math.min(section.wallMm ?? size / 2, size / 2);
      const bore = size - 2 * wall;
      return circleChordMm(size, x) - circleChordMm(bore, x - wall);
    }
  }
}

/** Passes as a count to loop over: anything but a finite number of at least 1 (unset, half-typed text, ∞) counts as one. */
function passCount(setup: Pick<CutSetup, 'passes'>): number {
  const p: unknown = setup.passes;
  return typeof p === 'number' && Number.isFinite(p) && p >= 1 ? Math.floor(p) : 1;
}

/** Whether the turning-specimen model applies (a round part). */
function turns(section: CutSection, motion: CutMotion): boolean {
  return motion === 'turning-specimen' && section.shape !== 'rectangular';
}

/** Said beside a turning part's profile: what its length figure is and is not. */
export const REMOVAL_LENGTH_PER_TURN_NOTE =
  'The part turns: at radius r the wheel clears a ring 2π·r long per turn, so the curve shows that effective removal length, not a contact arc — the arc the wheel touches at any moment is far shorter.';

/** What a profile's length figure is for this section and motion: a contact length, or a turning part's removal length per turn. */
export function contactMeasureOf(shape: Shape, motion: CutMotion): ContactMeasure {
  return motion === 'turning-specimen' && shape !== 'rectangular' ? 'removal-length-per-turn' : 'contact-length';
}

/** Depth the feed travels through material (mm): the size; to the centre or through the wall when the part turns. */
export function cutDepthMm(section: CutSection, motion: CutMotion): number {
  if (!turns(section, motion)) return section.sizeMm;
  return section.shape === 'tube' ? Math.min(section.wallMm ?? section.sizeMm / 2, section.sizeMm / 2) : section.sizeMm / 2;
}

/** Geometric contact length of a shallow pass of depth `aMm` with a wheel of `wheelDiameterMm`: √(a·D), mm. */
export function traverseContactMm(aMm: number, wheelDiameterMm: number): number {
  return Math.sqrt(aMm * wheelDiameterMm);
}

/** Contact length (mm) at depth `x` (mm) for the motion's model (see the file's header). */
export function contactLengthMm(section: CutSection, setup: Pick<CutSetup, 'motion' | 'passes' | 'wheelDiameterMm'>, x: number): number {
  const depth = cutDepthMm(section, setup.motion);
  if (x < 0 || x > depth) return 0;
  switch (setup.motion) {
    case 'straight-plunge':
    case 'pulsed-plunge':
    case 'stepped-depth':
      return sectionChordMm(section, x);
    case 'rocking':
      return ROCKING_CONTACT_FACTOR * sectionChordMm(section, x);
    case 'turning-specimen':
      return turns(section, 'turning-specimen') ? 2 * Math.PI * (section.sizeMm / 2 - x) : sectionChordMm(section, x);
    case 'traverse-pass':
      return traverseContactMm(section.sizeMm / passCount(setup), setup.wheelDiameterMm);
  }
}

/** Removal rate (mm³/s) at depth `x`: feed × wheel thickness × contact length (× pass depth for a traverse pass). */
export function removalRateMm3S(section: CutSection, setup: CutSetup, x: number): number {
  if (setup.motion === 'traverse-pass') {
    // Material is present at this level only where the section has width.
    const inPart = x >= 0 && x <= section.sizeMm;
    return inPart ? setup.feedMmS * setup.wheelThicknessMm * (section.sizeMm / passCount(setup)) : 0;
  }
  return setup.feedMmS * setup.wheelThicknessMm * contactLengthMm(section, setup, x);
}

/** Contact length and removal rate at `samples` evenly spaced depths from entry to the end of the cut. */
export function contactProfile(section: CutSection, setup: CutSetup, samples: number = PROFILE_SAMPLES): ContactPoint[] {
  const depth = cutDepthMm(section, setup.motion);
  const n = Number.isFinite(samples) ? Math.min(PROFILE_SAMPLES_MAX, Math.max(2, Math.floor(samples))) : PROFILE_SAMPLES;
  const points: ContactPoint[] = [];
  for (let i = 0; i < n; i++) {
    const x = (depth * i) / (n - 1);
    points.push({ depthMm: x, contactMm: contactLengthMm(section, setup, x), removalMm3S: removalRateMm3S(section, setup, x) });
  }
  return points;
}

/** Largest removal rate of a profile, mm³/s (0 for an empty profile). */
export function peakRemovalMm3S(points: readonly ContactPoint[]): number {
  return points.reduce((peak, p) => Math.max(peak, p.removalMm3S), 0);
}

/** Widest section chord within the depth band [from, to], mm (sampled; exact for the shapes' convex pieces at the ends and centre). */
function widestChordMm(section: CutSection, from: number, to: number): number {
  const candidates = [from, to, section.sizeMm / 2].filter((x) => x >= from && x <= to);
  for (let i = 1; i < 16; i++) candidates.push(from + ((to - from) * i) / 16);
  return Math.max(...candidates.map((x) => sectionChordMm(section, x)));
}

/**
 * Feed travel of the whole cut, mm:
 * - plunge, pulsed plunge, rocking: the size;
 * - turning specimen: to the centre (round bar) or through the wall (tube);
 * - stepped depth with N steps: each step re-enters through the kerf already cut, at feed
 *   speed (the conservative assumption): Σ i·H/N = H·(N + 1)/2;
 * - traverse pass: per pass, the widest extent of the section in that pass's depth band
 *   plus the contact length √(a·D) to run the wheel fully in and out.
 * Retractions of a pulsed plunge are not counted.
 */
export function cutTravelMm(section: CutSection, setup: CutSetup): number {
  const h = section.sizeMm;
  const n = passCount(setup);
  switch (setup.motion) {
    case 'straight-plunge':
    case 'pulsed-plunge':
    case 'rocking':
    case 'turning-specimen':
      return cutDepthMm(section, setup.motion);
    case 'stepped-depth':
      return (h * (n + 1)) / 2;
    case 'traverse-pass': {
      const a = h / n;
      const l = traverseContactMm(a, setup.wheelDiameterMm);
      let travel = 0;
      for (let i = 0; i < n; i++) travel += widestChordMm(section, i * a, (i + 1) * a) + l;
      return travel;
    }
  }
}

/**
 * Estimated cutting time, s: entry length / entry feed + remaining travel / feed. Without
 * an entry feed the whole travel runs at the feed. An entry longer than the travel is cut
 * to the travel.
 */
export function estimateCutTimeS(section: CutSection, setup: CutSetup): number {
  const travel = cutTravelMm(section, setup);
  const entryFeed = setup.entryFeedMmS;
  const entry = entryFeed !== null && entryFeed > 0 && setup.entryLengthMm !== null ? Math.min(Math.max(setup.entryLengthMm, 0), travel) : 0;
  return (entry > 0 ? entry / entryFeed! : 0) + (travel - entry) / setup.feedMmS;
}
