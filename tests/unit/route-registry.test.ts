import { describe, expect, it } from 'vitest';
import { policyActions } from '../../server/auth/policy';
import { routeRegistry } from '../../server/routes';

describe('route registry', () => {
  it('declares each method and path once', () => {
    const keys = routeRegistry.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('gives every route a policy action from the one policy table and a summary', () => {
    for (const r of routeRegistry) {
      expect(policyActions, `${r.method} ${r.path}`).toContain(r.action);
      expect(r.summary.length).toBeGreaterThan(5);
      expect(r.path.startsWith('/')).toBe(true);
    }
  });

  it('declares input schemas for every route that takes parameters', () => {
    for (const r of routeRegistry) {
      if (r.path.includes(':')) expect(r.params, `${r.method} ${r.path} needs a params schema`).toBeDefined();
      if (['post', 'put', 'patch'].includes(r.method)) expect(r.body, `${r.method} ${r.path} needs a body schema`).toBeDefined();
    }
  });
});
