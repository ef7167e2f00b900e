// The reading judgement of lib/trade, fed with what the phone knows: the item, the vehicle's
// spec, and this phone's torque wrench and tread-depth region.
import { judgeReading, type ReadingJudgement } from '../../lib/trade';
import type { LocalVehicle } from '../../lib/device/db';
import type { TreadRegion, WrenchRange } from '../../lib/device/settings';
import type { ItemOf } from '../../lib/device/visit-progress';

export type PhoneSettings = { wrench: WrenchRange | null; region: TreadRegion };

export function judgeItem(item: ItemOf, vehicle: LocalVehicle | undefined, settings: PhoneSettings, value: number | string): ReadingJudgement {
  return judgeReading(
    { value },
    {
      rule: item.rule,
      unit: item.unit ?? '',
      expectedMin: item.expectedMin,
      expectedMax: item.expectedMax,
      vehicle: vehicle
        ? {
            oilGrade: vehicle.oilGrade,
            oilCapacityL: vehicle.oilCapacityL,
            brakeFluidGrade: vehicle.brakeFluidGrade,
            plugGapMm: vehicle.plugGapMm,
            plugTorqueNm: vehicle.plugTorqueNm,
            sumpPlugTorqueNm: vehicle.sumpPlugTorqueNm,
            wheelNutTorqueNm: vehicle.wheelNutTorqueNm,
            tyrePressureFrontKpa: vehicle.tyrePressureFrontKpa,
            tyrePressureRearKpa: vehicle.tyrePressureRearKpa,
          }
        : undefined,
      wrench: settings.wrench,
      region: settings.region,
    },
  );
}

export type { ReadingJudgement };
