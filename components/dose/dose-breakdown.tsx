import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import type { DoseWarning } from '../../shared/compute/dose';
import { formatCarb, formatGlucose, glucoseFromMmol } from '../../shared/compute/units';
import { ACTIVE_INSULIN_MODEL_WORDS, minutesToTime } from '../../shared/schemas/profile-settings';
import type { DoseSuggestion } from '../../shared/schemas/dose';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { formatDoseUnits, formatInsulinUnits as unitsText } from './insulin-format';


function Line({ label, detail, amount }: { label: string; detail?: string; amount?: string }) {
  const t = useTheme();
  return (
    <View style={[styles.line, { borderColor: t.colors.border }]} role="listitem">
      <View style={styles.lineText}>
        <Text weight="bold">{label}</Text>
        {detail ? <Text color="textMuted">{detail}</Text> : null}
      </View>
      {amount ? (
        <Text variant="lead" weight="bold" style={styles.amount}>
          {amount}
        </Text>
      ) : null}
    </View>
  );
}

export function DoseWarnings({ warnings }: { warnings: DoseWarning[] }) {
  return (
    <>
      {warnings.map((w) => (
        <Callout key={w.code} tone={w.tone}>
          {w.message}
        </Callout>
      ))}
    </>
  );
}

/** A dose suggestion as a readable sum: the warnings first, then the dose, every part of the sum and the two-part dose. */
export function DoseBreakdownView({ result }: { result: DoseSuggestion }) {
  if (result.status === 'no_settings') {
    return (
      <View style={styles.stack}>
        <Callout tone="caution" title="No dose suggested">
          <Text>{result.warnings[0]?.message}</Text>
          <Link href="/settings" asChild>
            <Button label="Set up ratios and limits" variant="secondary" />
          </Link>
        </Callout>
        <DoseWarnings warnings={result.warnings.slice(1)} />
      </View>
    );
  }
  if (result.status === 'treat_low') {
    return (
      <View style={styles.stack}>
        <Callout tone="danger" title={`Low: ${formatGlucose(result.glucoseMmol, result.glucoseUnit)} — no dose`}>
          {result.warnings[0]?.message}
        </Callout>
      </View>
    );
  }
  const b = result.breakdown;
  const unit = result.glucoseUnit;
  const g = (mmol: number) => formatGlucose(mmol, unit);
  const cf = glucoseFromMmol(b.correctionFactorMmol, unit);
  const cfText = unit === 'mmol_l' ? `${cf.toFixed(1)} mmol/L` : `${Math.round(cf)} mg/dL`;
  const timeOfDayText = `${minutesToTime(result.timeOfDay.startMinute)}–${minutesToTime(result.timeOfDay.endMinute)}`;
  const correction =
    b.correctionReason === 'above_range' || b.correctionReason === 'below_range_negative'
      ? { detail: `(${g(b.glucoseMmol!)} − ${g(b.correctionTargetMmol)}) ÷ ${cfText} per unit`, amount: `${b.correctionUnits >= 0 ? '+' : '−'} ${unitsText(Math.abs(b.correctionUnits))}` }
      : {
          detail: {
            in_range: `${g(b.glucoseMmol ?? 0)} is within your target range: no correction.`,
            below_range_none: `${g(b.glucoseMmol ?? 0)} is below your target range: no correction (negative correction is off).`,
            no_glucose: 'Left out: no glucose reading.',
            stale_glucose: 'Left out: the reading is more than 15 minutes from the meal time.',
          }[b.correctionReason as 'in_range' | 'below_range_none' | 'no_glucose' | 'stale_glucose'],
          amount: `+ ${unitsText(0)}`,
        };
  return (
    <View style={styles.stack}>
      <DoseWarnings warnings={result.warnings} />
      <Card aria-label="Suggested dose">
        <Text variant="label" color="textMuted">
          Suggested dose · {result.dayKind.name}, {timeOfDayText}
        </Text>
        <Text variant="number" aria-label={formatDoseUnits(b.doseUnits)}>
          {formatDoseUnits(b.doseUnits)}
        </Text>
        {result.split ? (
          <Text variant="lead">
            Take {formatDoseUnits(result.split.nowUnits)} now and {formatDoseUnits(result.split.laterUnits)} in {result.split.laterMinutes} minutes.
          </Text>
        ) : null}
      </Card>
      <Card>
        <Text variant="heading">How it adds up</Text>
        <View role="list">
          <Line
            label="Meal"
            detail={`${formatCarb(b.carbsGrams)} ÷ ${b.carbRatio} g per unit (ratio for ${result.dayKind.name}, ${timeOfDayText})`}
            amount={unitsText(b.mealUnits)}
          />
          {b.exercisePercent > 0 ? (
            <Line label="Exercise after the meal" detail={`− ${b.exercisePercent} % of the meal part`} amount={`− ${unitsText(b.exerciseUnits)}`} />
          ) : null}
          <Line label="Correction" detail={correction.detail} amount={correction.amount} />
          {b.activeInsulinUnits > 0 ? (
            <Line
              label="Insulin still active"
              detail={`${unitsText(b.activeInsulinUnits)} from earlier doses; ${b.activeInsulinSubtracted > 0 ? 'taken off' : 'nothing to take off the correction'}`}
              amount={`− ${unitsText(b.activeInsulinSubtracted)}`}
            />
          ) : null}
          <Line label="Total before rounding" amount={unitsText(b.totalBeforeRounding)} />
          <Line label="Rounded to your pen step" amount={formatDoseUnits(b.roundedUnits)} />
          {b.capped ? <Line label="Capped at your largest single dose" amount={formatDoseUnits(b.doseUnits)} /> : null}
        </View>
        <Text color="textMuted">
          Active insulin model: {ACTIVE_INSULIN_MODEL_WORDS[b.activeInsulinModel].toLowerCase()} ({b.actionTimeHours} hours), from your settings.
        </Text>
        {result.fatProteinUnits != null ? (
          <Text color="textMuted">
            Fat and protein: {result.fatProteinUnits.toFixed(1)} fat-protein units (100 kcal each, Pańkowska 2009), shown
            for information only — not part of this dose.
          </Text>
        ) : null}
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: 12 },
  line: { flexDirection: 'row', alignItems: 'center', gap: 12, paddingVertical: 8, borderBottomWidth: 1 },
  lineText: { flex: 1, gap: 2 },
  amount: { fontVariant: ['tabular-nums'] },
});
