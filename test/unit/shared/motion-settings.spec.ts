/**
 * The cut motion's settings: the schema (older content without them reads as "not given"),
 * their text for the sheet and the review, their comparison, and the checks on values that
 * are clearly wrong, each with its worked example.
 */
import { expect } from 'chai';
import { motionSettingChecks } from '../../../shared/motion-checks';
import { cutMotionText, motionSettingRows, motionSettingsMissing, motionSettingsText } from '../../../shared/motion-settings';
import { compareVersions, type StockNames } from '../../../shared/recipe-compare';
import { CHECK_IDS, runChecks } from '../../../shared/recipe-checks';
import { recipeContent, type RecipeContent } from '../../../shared/schemas/recipe';
import { MOTION_SETTINGS } from '../../../shared/vocabulary';
import { content, ctx } from './fixtures';

const names: StockNames = { materials: new Map(), wheels: new Map(), machines: new Map() };

/** Content as an older Kerfbook stored it: no motion-setting keys at all. */
function withoutSettings(c: RecipeContent): RecipeContent {
  const cutting: Record<string, unknown> = { ...c.cutting };
  for (const key of MOTION_SETTINGS) delete cutting[key];
  return { ...c, cutting } as RecipeContent;
}

describe('shared/motion-settings', () => {
  describe('schema', () => {
    it('reads content stored without the settings as "not given" (null), without asking for them', () => {
      const parsed = recipeContent.parse(withoutSettings(content({ cutting: { cutMotion: 'pulsed-plunge' } })));
      for (const key of MOTION_SETTINGS) expect(parsed.cutting[key], key).to.equal(null);
    });

    it('keeps given settings and refuses impossible ones with the setting’s name and unit', () => {
      const ok = recipeContent.parse(content({ cutting: { cutMotion: 'rocking', rockingAngleDeg: 10, rockingStrokeMm: 8 } }));
      expect(ok.cutting).to.include({ rockingAngleDeg: 10, rockingStrokeMm: 8 });
      // A pause in the cut without backing off is a retract of 0.
      expect(recipeContent.safeParse(content({ cutting: { pulseAdvanceMm: 0.5, pulseRetractMm: 0 } })).success).to.equal(true);

      const message = (over: Partial<RecipeContent['cutting']>) => {
        const r = recipeContent.safeParse(content({ cutting: over }));
        return r.success ? null : r.error.issues[0]!.message;
      };
      expect(message({ pulseAdvanceMm: 0 })).to.equal('Advance per pulse must be more than 0 mm.');
      expect(message({ pulseRetractMm: -0.1 })).to.equal('Retract per pulse must be at least 0 mm.');
      expect(message({ rockingAngleDeg: 120 })).to.equal('Rocking angle (total swing) must be at most 90 °.');
      expect(message({ specimenRpm: 5000 })).to.equal('Specimen speed must be at most 1000 rpm.');
      expect(message({ stepDepthMm: Number.NaN })).to.match(/Step depth must be/);
      expect(message({ pulseFeedS: '2' as unknown as number })).to.equal('Feeding time per pulse must be a number (s).');
    });
  });

  describe('text', () => {
    it('pulsed plunge by distance, or by time', () => {
      const byDistance = content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 } });
      expect(motionSettingsText(byDistance)).to.equal('advance per pulse 0.50 mm, retract per pulse 0.20 mm');
      expect(cutMotionText(byDistance)).to.equal('Pulsed plunge: advance per pulse 0.50 mm, retract per pulse 0.20 mm');
      // 0.5 mm = 0.0197 in.
      expect(motionSettingsText(byDistance, 'metric+imperial')).to.equal('advance per pulse 0.50 mm (0.020 in), retract per pulse 0.20 mm (0.008 in)');
      const byTime = content({ cutting: { cutMotion: 'pulsed-plunge', pulseFeedS: 3, pulsePauseS: 1 } });
      expect(motionSettingsText(byTime)).to.equal('feeding time per pulse 3.0 s, pause between pulses 1.0 s');
    });

    it('rocking, turning specimen, traverse and stepped depth, with their units and passes', () => {
      expect(cutMotionText(content({ cutting: { cutMotion: 'rocking', rockingAngleDeg: 10 } }))).to.equal('Rocking: rocking angle (total swing) 10°');
      expect(cutMotionText(content({ cutting: { cutMotion: 'rocking', rockingStrokeMm: 8 } }))).to.equal('Rocking: rocking stroke 8.00 mm');
      expect(cutMotionText(content({ cutting: { cutMotion: 'turning-specimen', specimenRpm: 30 } }))).to.equal('Turning specimen: specimen speed 30 rpm');
      expect(cutMotionText(content({ cutting: { cutMotion: 'traverse-pass', depthPerPassMm: 0.5, passes: 40 } }))).to.equal(
        'Traverse pass: depth per pass 0.50 mm, 40 passes',
      );
      expect(cutMotionText(content({ cutting: { cutMotion: 'stepped-depth', stepDepthMm: 10, passes: 4 } }))).to.equal(
        'Stepped depth: step depth 10.0 mm, 4 passes',
      );
    });

    it('a straight plunge has no settings; a motion without any given says so; settings of another motion are not shown', () => {
      expect(cutMotionText(content())).to.equal('Straight plunge');
      expect(motionSettingsText(content())).to.equal('');
      const old = withoutSettings(content({ cutting: { cutMotion: 'rocking' } }));
      expect(motionSettingsText(old)).to.equal('settings not given');
      expect(motionSettingsMissing(old)).to.equal(true);
      expect(motionSettingRows(old)).to.deep.equal([]);
      // A pulse setting left from before the motion became rocking.
      const switched = content({ cutting: { cutMotion: 'rocking', pulseAdvanceMm: 0.5, rockingStrokeMm: 8 } });
      expect(motionSettingRows(switched)).to.deep.equal([{ key: 'rockingStrokeMm', label: 'Rocking stroke', value: '8.00 mm' }]);
      expect(motionSettingsMissing(content())).to.equal(false);
    });
  });

  describe('comparison', () => {
    const version = (c: RecipeContent, n: number) => ({ version: n, status: 'draft', title: 'T', content: c });

    it('names each changed setting with its unit, and reads content stored without them as "not given"', () => {
      const old = withoutSettings(content({ cutting: { cutMotion: 'pulsed-plunge' } }));
      const now = content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.5, pulseRetractMm: 0.2 } });
      const { parameters } = compareVersions(version(old, 1), version(now, 2), names, 'metric');
      expect(parameters).to.deep.equal([
        { path: 'cutting.pulseAdvanceMm', label: 'Advance per pulse', before: 'Not given', after: '0.50 mm' },
        { path: 'cutting.pulseRetractMm', label: 'Retract per pulse', before: 'Not given', after: '0.20 mm' },
      ]);
    });

    it('old content against the same content saved with every setting null shows no change', () => {
      const c = content({ cutting: { cutMotion: 'rocking' } });
      expect(compareVersions(version(withoutSettings(c), 1), version(c, 2), names, 'metric').parameters).to.deep.equal([]);
    });

    it('an angle change reads in degrees', () => {
      const a = content({ cutting: { cutMotion: 'rocking', rockingAngleDeg: 8 } });
      const b = content({ cutting: { cutMotion: 'rocking', rockingAngleDeg: 12.5 } });
      expect(compareVersions(version(a, 1), version(b, 2), names, 'metric').parameters).to.deep.equal([
        { path: 'cutting.rockingAngleDeg', label: 'Rocking angle (total swing)', before: '8°', after: '12.5°' },
      ]);
    });
  });

  describe('checks', () => {
    const ids = (c: RecipeContent) => motionSettingChecks(c).map((r) => r.id);

    it('every id is listed in CHECK_IDS and reported by runChecks', () => {
      const c = content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.3, pulseRetractMm: 0.3 } });
      const found = runChecks(c, ctx()).find((r) => r.id === 'pulse-retract-not-below-advance');
      expect(found).to.deep.include({ severity: 'blocker', path: 'cutting.pulseRetractMm' });
      for (const id of ['pulse-retract-not-below-advance', 'step-depth-above-size', 'pass-depth-above-size', 'passes-short-of-size'])
        expect(CHECK_IDS as readonly string[]).to.include(id);
    });

    it('pulsed plunge: advance 0.3 mm, retract 0.3 mm gains 0 mm per pulse (blocker); retract 0.2 mm gains 0.1 mm (fine)', () => {
      const [r] = motionSettingChecks(content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.3, pulseRetractMm: 0.3 } }));
      expect(r!.message).to.equal(
        'Each pulse advances 0.3 mm and retracts 0.3 mm: the wheel gains 0 mm per pulse and never cuts through. Retract less than it advances.',
      );
      expect(ids(content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.3, pulseRetractMm: 0.5 } }))).to.deep.equal([
        'pulse-retract-not-below-advance',
      ]);
      expect(ids(content({ cutting: { cutMotion: 'pulsed-plunge', pulseAdvanceMm: 0.3, pulseRetractMm: 0.2 } }))).to.deep.equal([]);
      // Only one of the two given, or the settings of a motion not chosen: nothing to judge.
      expect(ids(content({ cutting: { cutMotion: 'pulsed-plunge', pulseRetractMm: 0.5 } }))).to.deep.equal([]);
      expect(ids(content({ cutting: { cutMotion: 'rocking', pulseAdvanceMm: 0.3, pulseRetractMm: 0.5 } }))).to.deep.equal([]);
    });

    it('stepped depth: a 30 mm step on bars up to 25 mm cuts through in one step (warning); a 10 mm step does not', () => {
      const scope = { sizeMinMm: 10, sizeMaxMm: 25 };
      const [r] = motionSettingChecks(content({ scope, cutting: { cutMotion: 'stepped-depth', stepDepthMm: 30 } }));
      expect(r).to.deep.include({ id: 'step-depth-above-size', severity: 'warning', path: 'cutting.stepDepthMm' });
      expect(r!.message).to.contain('A depth step of 30 mm is at least as deep as the largest part (25 mm)');
      expect(r!.reason).to.contain('common practice');
      expect(ids(content({ scope, cutting: { cutMotion: 'stepped-depth', stepDepthMm: 25 } }))).to.deep.equal(['step-depth-above-size']);
      expect(ids(content({ scope, cutting: { cutMotion: 'stepped-depth', stepDepthMm: 10 } }))).to.deep.equal([]);
      expect(ids(content({ scope, cutting: { cutMotion: 'traverse-pass', depthPerPassMm: 40 } }))).to.deep.equal(['pass-depth-above-size']);
    });

    it('traverse: 12 passes of 0.5 mm reach 6 mm on bars up to 20 mm (warning: give at least 40 passes); 40 passes reach through', () => {
      const scope = { sizeMinMm: 10, sizeMaxMm: 20 };
      const [r] = motionSettingChecks(content({ scope, cutting: { cutMotion: 'traverse-pass', depthPerPassMm: 0.5, passes: 12 } }));
      expect(r).to.deep.include({ id: 'passes-short-of-size', severity: 'warning', path: 'cutting.passes' });
      expect(r!.message).to.equal(
        '12 passes of 0.5 mm reach 6 mm, short of the largest part (20 mm): the cut stops before it is through. Give at least 40 passes, or a deeper pass.',
      );
      expect(ids(content({ scope, cutting: { cutMotion: 'traverse-pass', depthPerPassMm: 0.5, passes: 40 } }))).to.deep.equal([]);
      // 3 × 0.1 mm is 0.30000000000000004 in floating point, not a shortfall on a 0.3 mm part.
      expect(ids(content({ scope: { sizeMinMm: 0.1, sizeMaxMm: 0.3 }, cutting: { cutMotion: 'stepped-depth', stepDepthMm: 0.1, passes: 3 } }))).to.deep.equal(
        [],
      );
      expect(ids(content({ scope, cutting: { cutMotion: 'stepped-depth', stepDepthMm: 5, passes: 3 } }))).to.deep.equal(['passes-short-of-size']);
    });

    it('content stored without the settings raises none of them', () => {
      for (const motion of ['pulsed-plunge', 'rocking', 'turning-specimen', 'traverse-pass', 'stepped-depth'] as const)
        expect(ids(withoutSettings(content({ cutting: { cutMotion: motion, passes: 3 } }))), motion).to.deep.equal([]);
    });
  });
});
