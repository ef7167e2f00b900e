// The trade calculations, in one place that the phone and the server both import. Pure
// TypeScript: plain data in, plain data out; bad input throws an Error that says what is wrong.
export { convert, unit, unitsOf, isKnownUnit, sameDimension, UNITS } from './units';
export type { Dimension, UnitDefinition } from './units';
export { checkTorqueWrench, sparkPlugTightening, PLUG_THREADS, TORQUE_WRENCH_SOURCE, SPARK_PLUG_SOURCE } from './torque';
export type { TorqueWrenchCheck, SparkPlugTightening, PlugThread, PlugSeat, CylinderHead } from './torque';
export { parseOilGrade, oilFillPlan, OIL_GRADE_SOURCE } from './oil';
export type { OilGrade, OilFillPlan } from './oil';
export { brakeFluidMinimums, judgeBrakeFluidBoilingPoint, normaliseBrakeFluidGrade, BRAKE_FLUID_GRADES, BRAKE_FLUID_SOURCE } from './brake-fluid';
export type { BrakeFluidGrade, BrakeFluidMinimums, BrakeFluidJudgement } from './brake-fluid';
export { batteryStateOfCharge, judgeChargingVoltage, judgeEarthVoltageDrop, BATTERY_SOC_SOURCE, CHARGING_SOURCE, EARTH_DROP_SOURCE } from './battery';
export type { BatteryStateOfCharge, ChargingJudgement, EarthDropJudgement } from './battery';
export { coolantFreezePoint, glycolForProtection, COOLANT_SOURCES } from './coolant';
export type { Glycol, CoolantFreezePoint, GlycolForProtection } from './coolant';
export { judgeTreadDepth, judgeTyrePressure, TREAD_REGIONS, TYRE_PRESSURE_SOURCE } from './tyres';
export type { TreadRegion, TreadJudgement, TyrePressureJudgement } from './tyres';
export { checkVin, vinCheckDigit, VIN_SOURCE } from './vin';
export type { VinCheck } from './vin';
export { normaliseRegistration } from './registration';
export { nextServiceDue, addMonths } from './service-interval';
export type { NextServiceDue, ServiceDueStatus, DistanceUnit } from './service-interval';
export { invoiceTotals, formatMoney, minorDigits, roundHalfUp, ROUNDING_RULE, ROUNDING_RULE_TEXT } from './money';
export type { InvoiceTotals, InvoiceLine, PartLineInput, LabourLineInput } from './money';
export { judgeReading } from './judge-reading';
export type { ReadingRule, ReadingContext, ReadingJudgement } from './judge-reading';
export { SEVERITIES, worseSeverity } from './severity';
export type { Severity } from './severity';
export { parseTypedNumber } from './guard';
