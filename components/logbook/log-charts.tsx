import { useState, type ReactNode } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { BarChart } from 'react-native-gifted-charts';
import { CARB_UNIT_LABEL, formatCarb, formatGlucose, glucoseFromMmol, gramsToCarbUnit } from '../../shared/compute/units';
import type { LogCharts } from '../../shared/schemas/logbook-read';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { dayText } from '../ui/date-format';
import { percentText, unitsText } from './log-format';

const CHART_HEIGHT = 150;
const keepTogether = { dataSet: { print: 'label' } } as object;

function useWidth(): [number, (e: LayoutChangeEvent) => void] {
  const [width, setWidth] = useState(0);
  return [width, (e) => setWidth(Math.round(e.nativeEvent.layout.width))];
}

/** One chart with its title and the same figures as text (read aloud, printed, never colour alone). */
function ChartCard({ title, note, children, summary }: { title: string; note?: string; children: (width: number) => ReactNode; summary: string }) {
  const [width, onLayout] = useWidth();
  return (
    <Card {...keepTogether}>
      <Text variant="heading">{title}</Text>
      {note ? <Text color="textMuted">{note}</Text> : null}
      <View onLayout={onLayout} aria-hidden style={styles.chart}>
        {width > 0 ? children(width) : null}
      </View>
      <Text variant="caption" color="textMuted">
        {summary}
      </Text>
    </Card>
  );
}

function dayLabels(days: LogCharts['days']): string[] {
  const step = Math.max(1, Math.ceil(days.length / 7));
  // The day of the month under every few bars; the summary under the chart has the full dates.
  return days.map((d, i) => (i % step === 0 ? String(Number(d.date.slice(8))) : ''));
}

/** Bar geometry that fits `count` bars in the width given (gifted-charts draws scrollable charts otherwise). */
function bars(width: number, count: number) {
  const plot = Math.max(120, width - 56);
  const slot = plot / Math.max(count, 1);
  return { width: plot, barWidth: Math.max(4, slot * 0.6), spacing: Math.max(2, slot * 0.4), initialSpacing: slot * 0.2 };
}

/** The period's charts: carbohydrate and rapid-acting insulin per day, glucose before meals by day kind, time in range. */
export function LogChartsPanel({ data }: { data: LogCharts }) {
  const t = useTheme();
  const axis = { yAxisTextStyle: { color: t.colors.textMuted, fontSize: 11 }, xAxisLabelTextStyle: { color: t.colors.textMuted, fontSize: 10 } };
  const labels = dayLabels(data.days);
  const unitShort = CARB_UNIT_LABEL[data.carbUnit].short;
  const carbBars = data.days.map((d, i) => ({ value: gramsToCarbUnit(d.carbG, data.carbUnit), label: labels[i], frontColor: t.colors.primary }));
  const insulinBars = data.days.map((d, i) => ({ value: d.rapidUnits, label: labels[i], frontColor: t.colors.focus }));
  const before = data.beforeMeals.map((b) => ({
    value: glucoseFromMmol(b.averageMmol, data.glucoseUnit),
    label: b.dayKindName ?? 'No day kind',
    frontColor: t.colors.inRange,
  }));
  const tir = data.timeInRange;
  const range = `${formatGlucose(data.targetRange.lowMmol, data.glucoseUnit)}–${formatGlucose(data.targetRange.highMmol, data.glucoseUnit)}`;
  const pct = percentText;
  const totalCarb = data.days.reduce((a, d) => a + d.carbG, 0);
  const totalUnits = data.days.reduce((a, d) => a + d.rapidUnits, 0);
  const eaten = data.days.filter((d) => d.carbG > 0);
  const dosed = data.days.filter((d) => d.rapidUnits > 0);
  // Whole-unit steps on the insulin axis: four sections up to a multiple of four units.
  const insulinMax = Math.max(4, Math.ceil(Math.max(...data.days.map((d) => d.rapidUnits), 0) / 4) * 4);
  return (
    <View style={styles.list}>
      <ChartCard
        title="Carbohydrate per day"
        note={`${data.carbBasis === 'available' ? 'Available' : 'Total'} carbohydrate, ${CARB_UNIT_LABEL[data.carbUnit].long}.`}
        summary={`${formatCarb(totalCarb, data.carbUnit)} over ${data.days.length} days${eaten.map((d) => `; ${dayText(d.date)}: ${formatCarb(d.carbG, data.carbUnit)}`).join('')}`}
      >
        {(w) => <BarChart data={carbBars} height={CHART_HEIGHT} {...bars(w, carbBars.length)} noOfSections={4} yAxisLabelSuffix={` ${unitShort}`} yAxisLabelWidth={52} disableScroll {...axis} />}
      </ChartCard>
      <ChartCard
        title="Rapid-acting insulin per day"
        summary={`${unitsText(totalUnits)} over ${data.days.length} days${dosed.map((d) => `; ${dayText(d.date)}: ${unitsText(d.rapidUnits)}`).join('')}`}
      >
        {(w) => <BarChart data={insulinBars} height={CHART_HEIGHT} {...bars(w, insulinBars.length)} maxValue={insulinMax} noOfSections={4} yAxisLabelWidth={52} disableScroll {...axis} />}
      </ChartCard>
      <ChartCard
        title="Glucose before meals, by day kind"
        note="Average of the reading taken up to an hour before each meal."
        summary={
          data.beforeMeals.length
            ? data.beforeMeals.map((b) => `${b.dayKindName ?? 'No day kind'}: ${formatGlucose(b.averageMmol, data.glucoseUnit)} average of ${b.readings} (${formatGlucose(b.lowestMmol, data.glucoseUnit)} to ${formatGlucose(b.highestMmol, data.glucoseUnit)})`).join('; ')
            : 'No meal with a reading before it in this period.'
        }
      >
        {(w) => (before.length ? <BarChart data={before} height={CHART_HEIGHT} {...bars(w, before.length)} noOfSections={4} yAxisLabelWidth={52} disableScroll {...axis} /> : null)}
      </ChartCard>
      <ChartCard
        title="Time in range"
        note={`Target ${range}${data.targetRange.fromProfile ? ' (your settings)' : ' (the 2019 international consensus; set your own in Settings)'}. From finger-stick readings this is a share of readings, not of time.`}
        summary={`${tir.readings} readings: below ${pct(tir.belowPercent)}, in range ${pct(tir.inPercent)}, above ${pct(tir.abovePercent)}.`}
      >
        {(w) =>
          tir.readings ? (
            <BarChart
              stackData={[
                {
                  label: 'Readings',
                  stacks: [
                    { value: tir.belowPercent ?? 0, color: t.colors.danger },
                    { value: tir.inPercent ?? 0, color: t.colors.inRange },
                    { value: tir.abovePercent ?? 0, color: t.colors.caution },
                  ],
                },
              ]}
              height={CHART_HEIGHT}
              width={Math.min(w - 56, 160)}
              maxValue={100}
              noOfSections={4}
              barWidth={56}
              initialSpacing={24}
              yAxisLabelSuffix=" %"
              yAxisLabelWidth={44}
              disableScroll
              {...axis}
            />
          ) : null
        }
      </ChartCard>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: 16 },
  chart: { minHeight: 40, overflow: 'hidden' },
});
