import { useState } from 'react';
import { checkTorqueWrench, convert, PLUG_THREADS, sparkPlugTightening, type CylinderHead, type PlugSeat, type PlugThread } from '../../lib/trade';
import { attempt, ChoiceGroup, ErrorNote, formatNumber, NoteList, NumberField, readNumber, Result, SelectField, SourceNote } from './parts';

type TorqueUnit = 'N.m' | '[lbf_av].[ft_i]';
const UNIT_LABEL: Record<TorqueUnit, string> = { 'N.m': 'N·m', '[lbf_av].[ft_i]': 'lbf·ft' };

export default function TorqueCalculator() {
  const [torqueUnit, setTorqueUnit] = useState<TorqueUnit>('N.m');
  const [target, setTarget] = useState('');
  const [wrenchMin, setWrenchMin] = useState('');
  const [wrenchMax, setWrenchMax] = useState('');
  const [thread, setThread] = useState<PlugThread>('M14');
  const [seat, setSeat] = useState<PlugSeat>('flat');
  const [head, setHead] = useState<CylinderHead>('aluminium');

  const u = UNIT_LABEL[torqueUnit];
  const toNm = (v: number) => convert(v, torqueUnit, 'N.m');
  const fromNm = (v: number) => convert(v, 'N.m', torqueUnit);
  const values = [readNumber(target), readNumber(wrenchMin), readNumber(wrenchMax)];
  const check = values.every((v) => v !== null)
    ? attempt(() => checkTorqueWrench({ targetNm: toNm(values[0]!), wrenchMinNm: toNm(values[1]!), wrenchMaxNm: toNm(values[2]!) }))
    : null;
  const severity = check?.value ? (check.value.position === 'on_scale' ? 'ok' : check.value.onScale ? 'watch' : 'soon') : null;
  const plug = sparkPlugTightening({ thread, seat, head });

  return (
    <div className="flex flex-col gap-4">
      <ChoiceGroup
        legend="Units"
        value={torqueUnit}
        onChange={setTorqueUnit}
        options={[
          { value: 'N.m', label: 'N·m' },
          { value: '[lbf_av].[ft_i]', label: 'lbf·ft' },
        ]}
      />
      <NumberField label="Torque to set" value={target} onChange={setTarget} unit={u} />
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Wrench lowest mark" value={wrenchMin} onChange={setWrenchMin} unit={u} />
        <NumberField label="Wrench maximum" value={wrenchMax} onChange={setWrenchMax} unit={u} />
      </div>
      {check?.error ? <ErrorNote message={check.error} /> : null}
      {check && check.error === null ? (
        <Result label="Wrench check" severity={severity} testId="torque-result">
          <p className="text-2xl font-bold" data-testid="torque-verdict">
            {check.value.position === 'on_scale' ? 'On the scale' : check.value.onScale ? 'On the scale, weakest part' : 'Off the scale'}
          </p>
          {check.value.warnings.map((w) => (
            <p key={w} className="text-lg">
              {w}
            </p>
          ))}
          <p className="text-base">
            Tolerance ±{check.value.permissibleDeviationPercent} %: a wrench in calibration applies {formatNumber(fromNm(check.value.appliedBandNm.min), 2)} to{' '}
            {formatNumber(fromNm(check.value.appliedBandNm.max), 2)} {u}.
          </p>
        </Result>
      ) : null}
      <SourceNote source={check?.value?.source ?? 'ISO 6789-1:2017; bottom-fifth warning: common practice'} />

      <h3 className="mt-2 text-xl font-bold">Spark plugs</h3>
      <SelectField label="Thread" value={thread} onChange={setThread} options={PLUG_THREADS.map((t) => ({ value: t, label: t }))} />
      <ChoiceGroup
        legend="Seat"
        value={seat}
        onChange={setSeat}
        options={[
          { value: 'flat', label: 'Flat (gasket)' },
          { value: 'taper', label: 'Taper' },
        ]}
      />
      <ChoiceGroup
        legend="Cylinder head"
        value={head}
        onChange={setHead}
        options={[
          { value: 'aluminium', label: 'Aluminium' },
          { value: 'cast_iron', label: 'Cast iron' },
        ]}
      />
      <Result label="Plug tightening" testId="plug-result">
        <p className="text-2xl font-bold" data-testid="plug-torque">
          {plug.torqueNm ? `${formatNumber(fromNm(plug.torqueNm.min), 1)}–${formatNumber(fromNm(plug.torqueNm.max), 1)} ${u}` : 'No published figure'}
        </p>
        <p className="text-lg">
          Without a wrench: {formatNumber(plug.turnAngleDeg, 1)}° after the plug seats finger-tight{seat === 'flat' ? ' (new gasket)' : ''}.
        </p>
        <NoteList notes={plug.notes} />
      </Result>
      <SourceNote source={plug.source} />
    </div>
  );
}
