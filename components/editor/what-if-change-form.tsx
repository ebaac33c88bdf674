// Setting a what-if's change from the inspector: a degraded connection or conductor (a resistance in series, a
// failing lug is a few ohms) or a scale on the loads of a panel. Goes to the what-if on show, or to a trial.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { ConductorId, WhatIfChange } from '@/shared/sheet';
import { parseQuantity } from '@/editor/quantity/parse-quantity';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { TextField } from '../ui/text-field';
import { Text } from '../ui/text';
import { ChoiceField } from './choice-field';

export type ChangeTarget =
  | { kind: 'run'; id: string; conductors: ConductorId[] }
  | { kind: 'connection'; id: string; conductors: ConductorId[] }
  | { kind: 'bus'; id: string };

export interface WhatIfChangeFormProps {
  target: ChangeTarget;
  /** Where the change will go, in words ("the what-if 'Failing lug'", "a trial, not saved"). */
  destination: string;
  onAdd: (change: WhatIfChange) => void;
}

export function WhatIfChangeForm({ target, destination, onAdd }: WhatIfChangeFormProps) {
  const conductors = target.kind === 'bus' ? [] : target.conductors;
  const [conductor, setConductor] = useState<string>(conductors.includes('N') ? 'N' : (conductors[0] ?? 'A'));
  const [amount, setAmount] = useState(target.kind === 'bus' ? '0.5' : '3');
  const [scope, setScope] = useState('downstream');
  const [error, setError] = useState<string | undefined>();

  const add = () => {
    const parsed = parseQuantity(amount, target.kind === 'bus' ? 'number' : 'ohm');
    if (!parsed.ok) return setError(parsed.message);
    if (target.kind === 'bus') {
      if (parsed.value < 0 || parsed.value > 100) return setError('The factor must be between 0 and 100');
      onAdd({ kind: 'scale-loads', elementId: target.id, factor: parsed.value, scope: scope as 'downstream' | 'panel' });
    } else {
      if (!(parsed.value > 0)) return setError('The resistance must be greater than zero (use the cut tool to open it)');
      const c = conductor as ConductorId;
      onAdd(target.kind === 'run' ? { kind: 'degrade-conductor', runId: target.id, conductor: c, addedOhms: parsed.value } : { kind: 'degrade-connection', connectionId: target.id, conductor: c, ohms: parsed.value });
    }
    setError(undefined);
  };

  return (
    <View style={styles.box} testID="what-if-change-form">
      <Text variant="small" tone="muted">
        {target.kind === 'bus' ? 'Scale the loads of this panel' : 'A resistance in series with one conductor (a failing lug or splice)'} — goes to {destination}.
      </Text>
      {target.kind !== 'bus' ? (
        <ChoiceField label="Conductor" value={conductor} options={conductors.map((c) => ({ value: c, label: c }))} onChange={setConductor} testID="change-conductor" />
      ) : (
        <ChoiceField
          label="Which loads"
          value={scope}
          options={[
            { value: 'downstream', label: 'Everything it feeds' },
            { value: 'panel', label: 'Its own loads only' },
          ]}
          onChange={setScope}
          testID="change-scope"
        />
      )}
      <TextField
        label={target.kind === 'bus' ? 'Factor (1 is as drawn)' : 'Resistance (Ω)'}
        value={amount}
        onChangeText={setAmount}
        error={error}
        testID="change-amount"
        autoCapitalize="none"
      />
      <Button label={target.kind === 'bus' ? 'Scale the loads' : 'Add the resistance'} variant="secondary" icon="plus" onPress={add} testID="change-add" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
});
