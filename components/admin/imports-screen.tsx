import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useImport, useImports, useStartImport } from '../api/foods';
import { ChoiceGroup } from '../ui/choice-group';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { AdminScreen } from './admin-screen';
import { FileInput } from './file-input';
import { ImportReport } from './import-report';

const LAYOUTS = {
  fdc: {
    label: 'FoodData Central CSV',
    files: 'food.csv, nutrient.csv, food_nutrient.csv, food_portion.csv, measure_unit.csv, food_category.csv, sr_legacy_food.csv',
    accept: '.csv,text/csv',
  },
  sr28: { label: 'SR28 ASCII', files: 'FOOD_DES.txt, NUT_DATA.txt, NUTR_DEF.txt, WEIGHT.txt, FD_GROUP.txt', accept: '.txt,text/plain' },
} as const;

/** Admins upload USDA tables and watch the import; past imports are listed with their reports. */
export function ImportsScreen() {
  return (
    <AdminScreen title="Dataset imports" subtitle="Load the USDA tables (public domain) beside the default IFCT 2017 table" current="/admin/imports">
      <Imports />
    </AdminScreen>
  );
}

function Imports() {
  const imports = useImports();
  const start = useStartImport();
  const [kind, setKind] = useState<'fdc' | 'sr28'>('fdc');
  const [files, setFiles] = useState<File[]>([]);
  const [currentId, setCurrentId] = useState<number | null>(null);
  const current = useImport(currentId);
  const finished = current.data && current.data.status !== 'running' ? current.data.id : null;
  const refetchImports = imports.refetch;
  useEffect(() => {
    if (finished != null) void refetchImports();
  }, [finished, refetchImports]);
  const upload = () =>
    start.mutate({ kind, files }, { onSuccess: (record) => { setCurrentId(record.id); setFiles([]); } });
  return (
    <>
      <Card>
        <ChoiceGroup
          label="Layout"
          value={kind}
          onChange={(v) => { setKind(v); setFiles([]); }}
          choices={[
            { value: 'fdc', label: LAYOUTS.fdc.label, hint: 'SR Legacy or Foundation download' },
            { value: 'sr28', label: LAYOUTS.sr28.label, hint: '~-quoted, ^-separated files' },
          ]}
        />
        <Text color="textMuted">Files: {LAYOUTS[kind].files}</Text>
        <FileInput files={files} onChange={setFiles} accept={LAYOUTS[kind].accept} />
        {start.error ? <Callout tone="danger" title="Not started">{(start.error as Error).message}</Callout> : null}
        <View style={styles.actions}>
          <Button label="Upload and import" disabled={!files.length} loading={start.isPending} onPress={upload} />
        </View>
        <Text variant="caption" color="textMuted">
          Every file is checked before anything is written; a bad file stops the import and the food table stays as it was.
          Re-importing the same files changes nothing.
        </Text>
      </Card>
      {current.data ? <ImportReport item={current.data} /> : null}
      <Text variant="heading">Earlier imports</Text>
      {imports.isPending ? <LoadingState /> : null}
      {imports.isError ? <ErrorState error={imports.error} onRetry={() => void imports.refetch()} /> : null}
      {imports.data?.length === 0 ? <Text color="textMuted">No imports yet.</Text> : null}
      {imports.data?.filter((i) => i.id !== currentId).map((i) => (
        <ImportReport key={i.id} item={i} />
      ))}
    </>
  );
}

const styles = StyleSheet.create({ actions: { flexDirection: 'row', gap: 12 } });
