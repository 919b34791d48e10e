import { expect } from 'chai';
import {
  ALL_STATUS_MARKS,
  APP_SURFACES,
  CHECK_SEVERITY_MARKS,
  RECIPE_STATUS_MARKS,
  STATUS_TONES,
  TONE_COLOURS,
  toneCustomProperties,
} from '../../../shared/status-colours';
import { RECIPE_STATUSES } from '../../../shared/vocabulary';

/**
 * Relative luminance of an sRGB colour: WCAG 2.1, definition "relative luminance"
 * (L = 0.2126 R + 0.7152 G + 0.0722 B, each channel linearised: c/12.92 when c ≤ 0.04045,
 * else ((c + 0.055)/1.055)^2.4).
 */
function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const [r, g, b] = m.slice(1).map((h) => {
    const c = parseInt(h, 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}

/** Contrast ratio: WCAG 2.1, definition "contrast ratio", (L1 + 0.05) / (L2 + 0.05), L1 the lighter. */
function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

/** WCAG 2.1 SC 1.4.3, Contrast (Minimum): 4.5:1 for normal-size text (the chips' label type). */
const TEXT_MINIMUM = 4.5;
/** WCAG 2.1 SC 1.4.11, Non-text Contrast: 3:1 for graphical objects. */
const GRAPHIC_MINIMUM = 3;

describe('status colours (one language for chips, check page and sheet)', () => {
  it('computes contrast the WCAG 2.1 way (worked examples)', () => {
    // Black on white is the largest ratio there is: (1 + 0.05) / (0 + 0.05) = 21.
    expect(contrastRatio('#000000', '#ffffff')).to.be.closeTo(21, 1e-9);
    // #767676 on white is the well-known lightest grey passing 4.5:1 (L = 0.1812, 1.05 / 0.2312 = 4.54).
    expect(contrastRatio('#767676', '#ffffff')).to.be.closeTo(4.54, 0.01);
    // One step lighter fails: #777777 gives 4.48.
    expect(contrastRatio('#777777', '#ffffff')).to.be.lessThan(4.5);
    // Order does not matter.
    expect(contrastRatio('#ffffff', '#1d5a2e')).to.equal(contrastRatio('#1d5a2e', '#ffffff'));
  });

  it('gives every chip text at least 4.5:1 against its own background', () => {
    for (const m of ALL_STATUS_MARKS) {
      expect(contrastRatio(m.ink, m.fill), `${m.label}: ${m.ink} on ${m.fill}`).to.be.at.least(TEXT_MINIMUM);
    }
  });

  it('keeps every status ink readable on the app surfaces it may sit on without a fill', () => {
    for (const tone of STATUS_TONES) {
      for (const [name, surface] of Object.entries(APP_SURFACES)) {
        expect(contrastRatio(TONE_COLOURS[tone].ink, surface), `${tone} ink on ${name}`).to.be.at.least(TEXT_MINIMUM);
      }
    }
  });

  it('draws box edges that stand out from the page (3:1, non-text)', () => {
    for (const tone of STATUS_TONES) {
      expect(contrastRatio(TONE_COLOURS[tone].edge, APP_SURFACES.page), `${tone} edge`).to.be.at.least(GRAPHIC_MINIMUM);
    }
  });

  it('never relies on colour alone: every status and severity has its own icon and word', () => {
    for (const m of ALL_STATUS_MARKS) {
      expect(m.icon, m.label).to.match(/^[a-z_]+$/);
      expect(m.label).to.match(/\w/);
    }
    const icons = RECIPE_STATUSES.map((s) => RECIPE_STATUS_MARKS[s].icon);
    expect(new Set(icons).size, 'version status icons').to.equal(icons.length);
    const severityIcons = Object.values(CHECK_SEVERITY_MARKS).map((m) => m.icon);
    expect(new Set(severityIcons).size, 'severity icons').to.equal(severityIcons.length);
  });

  it('gives the states that mean "do not use" colours apart from the one that means "use"', () => {
    expect(RECIPE_STATUS_MARKS.approved.tone).to.equal('go');
    expect(RECIPE_STATUS_MARKS.withdrawn.tone).to.equal('stop');
    expect(CHECK_SEVERITY_MARKS.blocker.tone).to.equal('stop');
    expect(RECIPE_STATUS_MARKS.superseded.tone).not.to.equal('go');
    const fills = new Set(STATUS_TONES.map((t) => TONE_COLOURS[t].fill));
    expect(fills.size, 'one fill per tone').to.equal(STATUS_TONES.length);
  });

  it('publishes each tone as CSS custom properties', () => {
    const properties = toneCustomProperties();
    expect(properties['--kb-tone-go-ink']).to.equal(TONE_COLOURS.go.ink);
    expect(properties['--kb-tone-stop-fill']).to.equal(TONE_COLOURS.stop.fill);
    expect(Object.keys(properties)).to.have.length(STATUS_TONES.length * 3);
  });
});
