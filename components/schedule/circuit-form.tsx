// The form for one circuit of a panel schedule: description, circuit, phases, load, power factor, behaviour and the
// breaker's rating. Saving hands the edit back; the editor applies it as one undoable step or says why not.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { PhaseId } from '@/shared/sheet';
import type { CircuitEdit } from '@/editor/schedule/circuit-edit';
import { BEHAVIOUR_LABEL, BEHAVIOURS, type ScheduleRow } from '@/editor/schedule/panel-schedule';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { TextField } from '../ui/text-field';
import { ChoiceField } from '../editor/choice-field';

export interface CircuitFormProps {
  row: ScheduleRow;
  /** The phase choices that fit the circuit on this panel ("A", "AB", "ABC"). */
  phaseOptions: string[];
  onSave: (edit: CircuitEdit) => string | null;
  onCancel: () => void;
}

const num = (s: string) => (s.trim() === '' ? NaN : Number(s.trim().replace(',', '.')));

export function CircuitForm({ row, phaseOptions, onSave, onCancel }: CircuitFormProps) {
  const [description, setDescription] = useState(row.description);
  const [circuit, setCircuit] = useState(row.circuitGiven ? row.circuit : '');
  const [phases, setPhases] = useState(row.phases.join(''));
  const [amount, setAmount] = useState(String(row.givenAs === 'kw' ? row.kw : row.amperesGiven));
  const [pf, setPf] = useState(String(row.powerFactor));
  const [behaviour, setBehaviour] = useState<string>(row.behaviour);
  const [breaker, setBreaker] = useState(row.breaker?.ratingAmperes !== undefined ? String(row.breaker.ratingAmperes) : '');
  const [error, setError] = useState<string | null>(null);
  const unit = row.givenAs === 'kw' ? 'kW' : 'A';

  const save = () => {
    const amountValue = num(amount);
    const pfValue = num(pf);
    if (Number.isNaN(amountValue)) return setError(`The load must be a number (${unit})`);
    if (Number.isNaN(pfValue)) return setError('The power factor must be a number');
    const edit: CircuitEdit = {
      description,
      circuit,
      phases: phases.split('') as PhaseId[],
      amount: amountValue,
      powerFactor: pfValue,
      ...(behaviour !== 'mix' ? { behaviour: behaviour as CircuitEdit['behaviour'] } : {}),
    };
    if (row.breaker) {
      const b = breaker.trim() === '' ? null : num(breaker);
      if (b !== null && Number.isNaN(b)) return setError('The breaker rating must be a number of amperes');
      edit.breakerAmperes = b;
    }
    const problem = onSave(edit);
    setError(problem);
  };

  return (
    <View style={styles.form} testID={`circuit-form-${row.loadId}`}>
      <View style={styles.pair}>
        <View style={styles.narrow}>
          <TextField label="Circuit" value={circuit} onChangeText={setCircuit} placeholder={row.circuit} testID="circuit-field-circuit" />
        </View>
        <View style={styles.wide}>
          <TextField label="Description" value={description} onChangeText={setDescription} testID="circuit-field-description" />
        </View>
      </View>
      {phaseOptions.length > 1 ? (
        <ChoiceField label="Phases" value={phases} options={phaseOptions.map((p) => ({ value: p, label: p.split('').join('–') }))} onChange={setPhases} testID="circuit-field-phases" />
      ) : null}
      <View style={styles.pair}>
        <View style={styles.half}>
          <TextField label={`Load (${unit})`} value={amount} onChangeText={setAmount} inputMode="decimal" testID="circuit-field-amount" />
        </View>
        <View style={styles.half}>
          <TextField label="Power factor" value={pf} onChangeText={setPf} inputMode="decimal" testID="circuit-field-pf" />
        </View>
      </View>
      <ChoiceField
        label="Behaviour with voltage"
        value={behaviour}
        options={[...BEHAVIOURS, ...(row.behaviour === 'mix' ? (['mix'] as const) : [])].map((b) => ({ value: b, label: b === 'mix' ? row.behaviourLabel : BEHAVIOUR_LABEL[b] }))}
        onChange={setBehaviour}
        testID="circuit-field-behaviour"
      />
      {row.breaker ? (
        <TextField label={`Breaker rating (A) — ${row.breaker.name}`} value={breaker} onChangeText={setBreaker} inputMode="decimal" testID="circuit-field-breaker" />
      ) : null}
      <FormMessage message={error} testID="circuit-form-error" />
      <View style={styles.buttons}>
        <Button label="Cancel" variant="secondary" compact onPress={onCancel} testID="circuit-cancel" />
        <Button label="Save circuit" compact onPress={save} testID="circuit-save" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.md, paddingVertical: space.sm },
  pair: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap' },
  narrow: { width: 96 },
  wide: { flex: 1, minWidth: 180 },
  half: { flex: 1, minWidth: 120 },
  buttons: { flexDirection: 'row', gap: space.sm, justifyContent: 'flex-end' },
});
