/**
 * The lint rules that keep the layout honest must be able to fail: shared/ importing a
 * framework or Node, a client feature reaching into another feature. Each case lints a
 * small text as if it stood at that path, with the repository's own configuration.
 */
import { expect } from 'chai';
import path from 'node:path';
import { ESLint } from 'eslint';

const ROOT = path.resolve(import.meta.dirname, '../../..');
const eslint = new ESLint({ cwd: ROOT, overrideConfigFile: path.join(ROOT, '.config/eslint.config.js') });

async function rulesBroken(filePath: string, text: string): Promise<string[]> {
  const [result] = await eslint.lintText(text, { filePath: path.join(ROOT, filePath) });
  return result!.messages.map((m) => m.ruleId ?? m.message);
}

describe('lint boundaries', function () {
  this.timeout(60_000);

  for (const source of ['@angular/core', 'express', 'knex', 'node:crypto']) {
    it(`refuses ${source} in shared/`, async () => {
      const broken = await rulesBroken('shared/probe.ts', `import { x } from '${source}';\nexport const y = x;\n`);
      expect(broken).to.include('no-restricted-imports');
    });
  }

  it('refuses server code in shared/', async () => {
    const broken = await rulesBroken('shared/probe.ts', "import { AppError } from '../server/app-error';\nexport const y = AppError;\n");
    expect(broken).to.include('no-restricted-imports');
  });

  it('lets shared/ import zod and itself', async () => {
    const broken = await rulesBroken('shared/probe.ts', "import { z } from 'zod';\nimport { SHAPES } from './vocabulary';\nexport const y = z.enum(SHAPES);\n");
    expect(broken).to.deep.equal([]);
  });

  it('refuses a client feature importing another feature', async () => {
    const broken = await rulesBroken('src/app/recipes/probe.ts', "import { StockPage } from '../stock/stock-page';\nexport const y = StockPage;\n");
    expect(broken).to.include('boundaries/dependencies');
  });

  it('lets a feature import its own files, core/ and ui/', async () => {
    const text = [
      "import { recipesRoutes } from './recipes.routes';",
      "import { Notifier } from '../core/notifier/notifier';",
      "import { MarkdownView } from '../ui/markdown-view';",
      'export const y = [recipesRoutes, Notifier, MarkdownView];',
      '',
    ].join('\n');
    const broken = await rulesBroken('src/app/recipes/probe.ts', text);
    expect(broken).to.deep.equal([]);
  });

  it('refuses ui/ importing a feature', async () => {
    const broken = await rulesBroken('src/app/ui/probe.ts', "import { StockPage } from '../stock/stock-page';\nexport const y = StockPage;\n");
    expect(broken).to.include('boundaries/dependencies');
  });
});
