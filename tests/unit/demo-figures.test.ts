import { expect, it } from 'vitest';
import { demoFigures } from '../../server/seed/sections/demo-figures-data';
import { figureInput } from '../../src/shared/schemas/figures';

it('every demo figure is one the API would accept', () => {
  for (const f of demoFigures.flatMap((g) => g.figures)) expect(figureInput.safeParse(f).success, f.fastener).toBe(true);
});
