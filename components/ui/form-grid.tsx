import { Children, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';

type Props = {
  children: ReactNode;
  /** The narrowest a cell may be before the grid drops to fewer columns (one column on a phone). */
  minCell?: number;
  'aria-label'?: string;
};

/**
 * The one grid for form fields side by side: equal cells whose tops line up (a hint or an error under one field
 * never shifts its neighbours' inputs), wrapping to fewer columns as the screen narrows.
 */
export function FormGrid({ children, minCell = 180, ...rest }: Props) {
  const cells = Children.toArray(children).filter(Boolean);
  return (
    <View style={styles.grid} role="group" aria-label={rest['aria-label']}>
      {cells.map((cell, i) => (
        <View key={i} style={[styles.cell, { flexBasis: minCell }]}>
          {cell}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: 12, rowGap: 12, alignItems: 'flex-start' },
  cell: { flexGrow: 1, flexShrink: 1, minWidth: 0 },
});
