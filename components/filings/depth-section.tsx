/**
 * SAR against depth for a chosen transmitter and use position: the engine's plane-wave model on
 * the tissue stack of the position's kind (head, trunk or limb). In W/kg only beyond the reactive
 * near field; closer, the profile's shape relative to the surface. Always labelled a screening
 * estimate that explains a margin, never a measured SAR.
 */
import { sourceWords } from '../source-words';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { FilingDetail } from '../../constants/schemas/filings';
import { palette, space } from '../../constants/theme';
import { useDepthProfileQuery, type ScreeningRowDto } from '../../hooks/queries/filings';
import { useIsWide } from '../../hooks/use-is-wide';
import { DepthProfileChart } from '../charts/depth-profile-chart';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { Notice } from '../ui/notice';
import { SelectField } from '../ui/select-field';
import { Sheet } from '../ui/sheet';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { formatMm, sig } from './format';
import { DerivationBlock } from './how-computed';

/** The close-up: every stack's finite layers lie within the first 20 mm. */
const LAYERS_VIEW_MM = 20;

/** The finite layers' names, for the close-up chip ("skin, fat, bone"). */
const finiteLayerNames = (stack: { name: string; thicknessM: number | null }[]) =>
  stack
    .filter((l) => l.thicknessM !== null)
    .map((l) => l.name)
    .join(', ');

export function DepthSection({ filing, initial }: { filing: FilingDetail; initial: ScreeningRowDto | null }) {
  const wide = useIsWide();
  const txs = filing.data.radios.transmitters;
  const positions = filing.data['use-positions'].usePositions;
  const [txId, setTxId] = useState(initial?.transmitterId ?? txs[0]?.id ?? null);
  const [posId, setPosId] = useState(initial?.usePositionId ?? positions[0]?.id ?? null);
  const [showHow, setShowHow] = useState(false);
  const [depthView, setDepthView] = useState<'layers' | 'all'>('layers');
  const profile = useDepthProfileQuery(filing.id, txId, posId);
  const p = profile.data;
  return (
    <Card title="SAR against depth" aside={<StatusBadge tone="caution" icon="info" label="Screening estimate" />} testID="depth-section">
      <Text variant="small" tone="soft">
        Why a margin is what it is: the transmitter’s time-averaged EIRP gives a power density at the use position’s distance, which enters flat tissue layers as a plane wave. The layers follow the
        kind of position (head, trunk or limb). It shows where the power goes; it is not a SAR measurement.
      </Text>
      <View style={[styles.pickers, wide && styles.pickersWide]}>
        <View style={styles.picker}>
          <SelectField
            label="Transmitter"
            options={txs.map((t) => ({
              value: t.id,
              label: `${t.id} — ${t.band}`,
            }))}
            value={txId}
            onChange={setTxId}
            testID="depth-tx"
          />
        </View>
        <View style={styles.picker}>
          <SelectField label="Use position" options={positions.map((u) => ({ value: u.id, label: u.id }))} value={posId} onChange={setPosId} testID="depth-position" />
        </View>
      </View>
      {profile.isError ? (
        <LoadFailed what="the depth profile" error={profile.error} />
      ) : !p ? (
        <Loading label="Computing the profile…" />
      ) : (
        <>
          <Text variant="smallStrong" accessibilityRole="header">
            {`Screening estimate: ${p.transmitterId} at ${p.usePositionId}`}
          </Text>
          <Text variant="small" testID="depth-model">
            {`Model: ${p.stackTitle} — flat layers, plane wave at normal incidence.`}
          </Text>
          <Text variant="small" testID="depth-scale-reason">
            {sourceWords(p.scaleReason)}
          </Text>
          <ChoiceChips
            label="Depth shown"
            choices={[
              {
                value: 'layers',
                label: `First ${LAYERS_VIEW_MM} mm (${finiteLayerNames(p.stack)})`,
              },
              {
                value: 'all',
                label: `Whole profile (${sig(Math.max(...p.relativeProfile.map((pt) => pt.depthM)) * 1000, 3)} mm)`,
              },
            ]}
            value={depthView}
            onChange={setDepthView}
            testID="depth-view"
          />
          <DepthProfileChart
            points={
              p.absolute
                ? p.absolute.sarProfile.map((pt) => ({
                    depthM: pt.depthM,
                    value: pt.sarWPerKg,
                  }))
                : p.relativeProfile.map((pt) => ({
                    depthM: pt.depthM,
                    value: pt.relativeSar,
                  }))
            }
            scale={p.scale}
            layers={p.stack}
            depthLimitMm={depthView === 'layers' ? LAYERS_VIEW_MM : undefined}
            testID="depth-chart"
          />
          <View style={styles.figures} testID="depth-figures">
            <Fig label="Separation" value={formatMm(p.basis.separationM)} />
            <Fig label="Frequency" value={`${sig(p.basis.frequencyHz / 1e6, 6)} MHz`} />
            <Fig label="Near-field boundary λ/2π" value={formatMm(p.reactiveNearFieldBoundaryM)} />
            <Fig label="Reflected at the surface" value={`${sig(p.reflectedFraction * 100, 3)} %`} />
            {p.absolute ? (
              <>
                <Fig label="Incident power density" value={`${sig(p.absolute.incidentPowerDensityWPerM2)} W/m²`} />
                <Fig label="SAR at the surface (estimate)" value={`${sig(p.absolute.surfaceSarWPerKg)} W/kg`} />
                <Fig label="1 g average (estimate)" value={`${sig(p.absolute.averagedSarWPerKg['1g'])} W/kg`} />
                <Fig label="10 g average (estimate)" value={`${sig(p.absolute.averagedSarWPerKg['10g'])} W/kg`} />
              </>
            ) : null}
          </View>
          <Button label="How computed" variant="secondary" compact icon="info" onPress={() => setShowHow(true)} style={{ alignSelf: 'flex-start' }} testID="depth-how" />
          <Notice tone="caution">{p.cautions[0] ?? 'A screening estimate.'}</Notice>
          <Sheet
            visible={showHow}
            onClose={() => setShowHow(false)}
            title="How computed: SAR against depth"
            subtitle={`${p.transmitterId} at ${p.usePositionId} · screening estimate`}
            testID="depth-how-computed"
          >
            <DerivationBlock d={p.derivation} />
          </Sheet>
        </>
      )}
    </Card>
  );
}

function Fig({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fig}>
      <Text variant="small" tone="muted">
        {label}
      </Text>
      <Text variant="figure" style={{ textAlign: 'left' }}>
        {value}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  pickers: { gap: space.md },
  pickersWide: { flexDirection: 'row' },
  picker: { flex: 1 },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  fig: {
    minWidth: 130,
    paddingVertical: space.xs,
    borderBottomWidth: 1,
    borderBottomColor: palette.paperDeep,
  },
});
