import { useState } from 'react';
import { BATTERY_SOC_SOURCE, batteryStateOfCharge, CHARGING_SOURCE, judgeChargingVoltage, judgeEarthVoltageDrop } from '../../lib/trade';
import { attempt, Caution, ErrorNote, formatNumber, NumberField, readNumber, Result, SourceNote } from './parts';

export default function BatteryCalculator() {
  const [resting, setResting] = useState('');
  const [temperature, setTemperature] = useState('');
  const [charging, setCharging] = useState('');
  const [earth, setEarth] = useState('');

  const restingV = readNumber(resting);
  const tempC = readNumber(temperature);
  const chargingV = readNumber(charging);
  const earthV = readNumber(earth);
  const soc = restingV === null ? null : attempt(() => batteryStateOfCharge(restingV, { electrolyteC: tempC }));
  const charge = chargingV === null ? null : attempt(() => judgeChargingVoltage(chargingV));
  const drop = earthV === null ? null : attempt(() => judgeEarthVoltageDrop(earthV));

  return (
    <div className="flex flex-col gap-4">
      <Caution>Batteries give off explosive gas and hold acid. No sparks or flames; disconnect the negative lead first and refit it last.</Caution>
      <NumberField label="Resting voltage" value={resting} onChange={setResting} unit="V" hint="Engine off for at least an hour, lights off." />
      <NumberField label="Battery temperature (optional)" value={temperature} onChange={setTemperature} unit="°C" />
      {soc?.error ? <ErrorNote message={soc.error} /> : null}
      {soc && soc.error === null ? (
        <Result label="State of charge" severity={soc.value.severity} testId="battery-result">
          <p className="text-4xl font-bold" data-testid="battery-percent">
            {formatNumber(soc.value.stateOfChargePercent, 0)} %
          </p>
          <div className="h-5 w-full overflow-hidden rounded-full border-2 border-ink bg-paper" role="presentation">
            <div className="h-full bg-brand" style={{ width: `${soc.value.stateOfChargePercent}%` }} />
          </div>
          {soc.value.compensatedVolts !== soc.value.restingVolts ? (
            <p className="text-base">Read as {formatNumber(soc.value.compensatedVolts, 3)} V at 26.7 °C.</p>
          ) : null}
          <p className="text-lg">{soc.value.message}</p>
        </Result>
      ) : null}
      <SourceNote source={BATTERY_SOC_SOURCE} />

      <h3 className="mt-2 text-xl font-bold">Charging and earth</h3>
      <NumberField label="Charging voltage at fast idle" value={charging} onChange={setCharging} unit="V" hint="About 2000 rpm, loads off." />
      {charge?.error ? <ErrorNote message={charge.error} /> : null}
      {charge && charge.error === null ? (
        <Result label="Charging" severity={charge.value.severity} testId="charging-result">
          <p className="text-lg">{charge.value.message}</p>
        </Result>
      ) : null}
      <NumberField label="Earth-side drop while cranking" value={earth} onChange={setEarth} unit="V" hint="Battery negative post to the engine." />
      {drop?.error ? <ErrorNote message={drop.error} /> : null}
      {drop && drop.error === null ? (
        <Result label="Earth drop" severity={drop.value.severity} testId="earth-result">
          <p className="text-lg">{drop.value.message}</p>
        </Result>
      ) : null}
      <SourceNote source={CHARGING_SOURCE} />
    </div>
  );
}
