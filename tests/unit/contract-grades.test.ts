import { describe, expect, it } from 'vitest';
import { CF_TABLE, cfFuelTypeForGrade, FUEL_GRADES as OPTIMIZER_GRADES } from '../../optimizer/index';
import { PRICED_FUEL_GRADES } from '../../shared/schemas/savings';
import { FUEL_GRADES as VESSEL_GRADES } from '../../shared/schemas/vessels';

// shared/ may import only zod, so it repeats the optimizer's grade codes; this keeps the copies in step.
describe('fuel grade codes agree across the contract and the optimizer', () => {
  it('the priced grades are exactly the optimizer grades', () => {
    expect([...PRICED_FUEL_GRADES]).toEqual([...OPTIMIZER_GRADES]);
  });
  it('every grade a vessel can carry has an IMO carbon factor (MEPC.364(79))', () => {
    for (const grade of VESSEL_GRADES) {
      expect(OPTIMIZER_GRADES as readonly string[]).toContain(grade);
      const { fuelType } = cfFuelTypeForGrade(grade);
      expect(CF_TABLE[fuelType].cfTCo2PerTFuel).toBeGreaterThan(0);
    }
  });
});
