// A count with its noun: the figure in the number font, the word in the text font ("3 sheets").
import { Text } from './text';

export function Count({ value, one, many = `${one}s`, testID }: { value: number; one: string; many?: string; testID?: string }) {
  return (
    <Text variant="small" tone="muted" testID={testID}>
      <Text variant="number" tone="muted" testID={testID ? `${testID}-figure` : undefined}>
        {value}
      </Text>{' '}
      {value === 1 ? one : many}
    </Text>
  );
}
