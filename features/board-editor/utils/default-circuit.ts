import type { CircuitSpec, DeviceOnRail } from '@/lib/sizing';

/**
 * A starting circuit for a way that had none: 1 kW of fixed load, 10 m clipped direct, 30 °C.
 * Single-phase in flat twin and earth; a three-pole way gets three-phase armoured cable,
 * since the twin-and-earth table has no three-phase column. The designer edits every field.
 */
export function startingCircuit(device: DeviceOnRail, boardPhases: 1 | 3): CircuitSpec {
  const three = boardPhases === 3 && device.poles >= 3;
  return {
    serves: '',
    phases: three ? 3 : 1,
    use: 'fixed',
    loadType: 'other',
    load: { kind: 'known', watts: 1000, powerFactor: 1 },
    lengthM: 10,
    cable: three ? 'swa-xlpe-90' : 'te-70',
    method: 'C',
    ambientC: 30,
    grouping: { circuits: 1, arrangement: 'bunched' },
    insulationMm: 0,
    csaMm2: null,
    concealedInWall: false,
  };
}
