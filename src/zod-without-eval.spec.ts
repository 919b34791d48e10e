import './zod-without-eval';
import { z } from 'zod';

describe('zod without eval', () => {
  it('runs zod jitless, so no schema ever asks the browser for new Function', () => {
    expect(z.config().jitless).toBe(true);
    // And parsing still works the same.
    expect(z.object({ feedMmS: z.number().positive() }).parse({ feedMmS: 0.3 })).toEqual({ feedMmS: 0.3 });
  });
});
