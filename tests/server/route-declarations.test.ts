import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REQUIREMENT } from '../../server/middlewares/authorize';
import { createTestContext, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

interface Layer {
  route?: { path: string; methods: Record<string, boolean>; stack: { handle: unknown }[] };
  handle: { stack?: Layer[] } & Record<symbol, unknown>;
}

function collectRoutes(stack: Layer[], found: { path: string; methods: string[]; declared: boolean }[] = []) {
  for (const layer of stack) {
    if (layer.route) {
      const declared = layer.route.stack.some((entry) => typeof entry.handle === 'function' && REQUIREMENT in (entry.handle as object));
      found.push({ path: layer.route.path, methods: Object.keys(layer.route.methods), declared });
    } else if (layer.handle?.stack) {
      collectRoutes(layer.handle.stack, found);
    }
  }
  return found;
}

describe('deny by default', () => {
  it('then every API route declares what it needs', () => {
    const router = (context.app as unknown as { router: { stack: Layer[] } }).router;
    const routes = collectRoutes(router.stack);
    expect(routes.length).toBeGreaterThan(8);
    const undeclared = routes.filter((route) => !route.declared).map((route) => `${route.methods.join(',')} ${route.path}`);
    expect(undeclared).toEqual([]);
  });
});
