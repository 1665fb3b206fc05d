import { describe, expect, it } from 'vitest';
import { parameterRole } from './parameter-roles';

describe('parameterRole(name)', () => {
  it('reads the catalog roles; a scan centre is an offset, an unknown or prototype name is geometry', () => {
    // DOMAIN.md §5: amplitude scales the curve, geometry changes its shape; DESIGN.md catalog names
    expect(['ampereTurns', 'moment', 'amplitude'].map(parameterRole)).toEqual(['amplitude', 'amplitude', 'amplitude']);
    expect(['radius', 'innerRadius', 'outerRadius', 'length', 'separation', 'width', 'height'].map(parameterRole)).toEqual(Array(7).fill('geometry'));
    expect(['probeOffset', 'centre', 'background', 'exponent'].map(parameterRole)).toEqual(['offset', 'offset', 'background', 'exponent']);
    // the conservative reading for a name the catalog does not have (common practice here: never report amplitude loss by guess)
    expect(['helix', 'constructor', '__proto__'].map(parameterRole)).toEqual(['geometry', 'geometry', 'geometry']);
  });
});
