import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import {
  readingsImportColumnsSchema,
  type ReadingsImportColumns,
  type ReadingsImportPreview,
  type ReadingsImportResult,
} from '../../shared/schemas/logbook-read';
import { FileInput } from '../admin/file-input';
import { useActiveProfile } from '../api/auth';
import { ApiError } from '../api/client';
import { useReadingsImport, useReadingsImportPreview } from '../api/logbook';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { ImportPreviewRows } from './import-preview-rows';

const UNIT_CHOICES = [
  { value: 'mmol_l', label: 'mmol/L' },
  { value: 'mg_dl', label: 'mg/dL' },
] as const;
const ORDER_CHOICES = [
  { value: 'day_month', label: 'Day, then month (31/01)' },
  { value: 'month_day', label: 'Month, then day (01/31)' },
] as const;
const FIELDS = ['timeColumn', 'valueColumn', 'unitColumn', 'unit', 'dateOrder'] as const;

const EMPTY: ReadingsImportColumns = { timeColumn: '', valueColumn: '', unitColumn: '', unit: 'mmol_l' };

/** Import glucose readings from a meter or sensor file: choose the file, map its columns, check the preview, import. */
export function ImportScreen() {
  const { profile } = useActiveProfile();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<ReadingsImportPreview | null>(null);
  const [done, setDone] = useState<ReadingsImportResult | null>(null);
  const [problem, setProblem] = useState<{ message: string; lines: string[] } | null>(null);
  const read = useReadingsImportPreview(profile?.id);
  const save = useReadingsImport(profile?.id);
  const form = useForm<ReadingsImportColumns>({ resolver: zodResolver(readingsImportColumnsSchema), defaultValues: EMPTY });

  const showError = (e: unknown) => {
    const message = applyServerErrors(e, form.setError, FIELDS) ?? 'Some choices need a look.';
    setProblem({ message, lines: e instanceof ApiError ? (e.fieldErrors?.file ?? []) : [] });
  };
  const runPreview = async (chosen: File, mapping: Partial<ReadingsImportColumns>) => {
    setProblem(null);
    setDone(null);
    try {
      const p = await read.mutateAsync({ file: chosen, mapping });
      setPreview(p);
      form.reset({ ...EMPTY, ...p.mapping, unitColumn: p.mapping.unitColumn ?? '' });
    } catch (e) {
      setPreview(null);
      showError(e);
    }
  };
  const onFile = (files: File[]) => {
    const chosen = files[0] ?? null;
    setFile(chosen);
    if (chosen) void runPreview(chosen, {});
  };
  const onImport = form.handleSubmit(async (mapping) => {
    setProblem(null);
    try {
      setDone(await save.mutateAsync({ file: file!, mapping }));
    } catch (e) {
      showError(e);
    }
  });

  const columns = (preview?.columns ?? []).map((c) => ({ value: c, label: c }));
  return (
    <Screen title="Import glucose readings" subtitle="From a meter or sensor file: CSV or TSV with a header row, up to 10 MB." backHref="/logbook">
      <Card>
        <Text variant="heading">1. Choose the file</Text>
        <FileInput files={file ? [file] : []} onChange={onFile} accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values" label="Readings file" multiple={false} testId="readings-file-input" />
        {read.isPending ? <Text color="textMuted">Reading the file…</Text> : null}
      </Card>
      {preview ? (
        <Card>
          <Text variant="heading">2. Which column holds what</Text>
          <Text color="textMuted">
            {preview.rows} rows · {preview.encoding === 'utf-8' ? 'UTF-8' : 'Latin-1'} · separated by {preview.delimiter === '\t' ? 'tabs' : `“${preview.delimiter}”`}. Times
            without a zone are read in {preview.timeZone}.
          </Text>
          <FormChoiceGroup control={form.control} name="timeColumn" label="Time" choices={columns} />
          <FormChoiceGroup control={form.control} name="valueColumn" label="Glucose value" choices={columns} />
          <FormChoiceGroup control={form.control} name="unitColumn" label="Unit column" choices={[{ value: '', label: 'None' }, ...columns]} />
          <FormChoiceGroup control={form.control} name="unit" label="Unit when a row does not say" choices={UNIT_CHOICES} />
          {preview.dateOrderNeeded || form.watch('dateOrder') ? (
            <FormChoiceGroup control={form.control} name="dateOrder" label="Dates are written" choices={ORDER_CHOICES} hint="Every date in this file could be read both ways." />
          ) : null}
          <View style={styles.row}>
            <Button variant="secondary" label="Show the preview" loading={read.isPending} onPress={form.handleSubmit((m) => runPreview(file!, m))} />
          </View>
        </Card>
      ) : null}
      {preview && !preview.dateOrderNeeded && (preview.firstRows.length || preview.errors.length) ? (
        <Card>
          <Text variant="heading">3. The first rows as they will be stored</Text>
          <ImportPreviewRows preview={preview} />
          <Button label={`Import ${preview.rows - preview.duplicates - preview.errors.length} readings`} loading={save.isPending} disabled={preview.errors.length > 0} onPress={() => void onImport()} />
        </Card>
      ) : null}
      {problem ? (
        <Callout tone="danger" title="Nothing was imported">
          {problem.message}
          {problem.lines.map((l) => `\n${l}`).join('')}
        </Callout>
      ) : null}
      {done ? (
        <Callout tone="ok" title="Imported">
          {done.imported} readings imported, {done.duplicatesSkipped} already in the logbook skipped.
        </Callout>
      ) : null}
      {done ? (
        <Link href="/logbook" asChild>
          <Button variant="secondary" label="Open the logbook" />
        </Link>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row' } });
