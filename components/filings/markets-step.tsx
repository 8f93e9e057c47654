/**
 * Step 4, Markets: which rule sets apply, general population or occupational, and for the FCC
 * how SAR screening is done (the §1.1307(b)(3) exemptions by default, or KDB 447498 test exclusion).
 */
import { Controller } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { FCC_SAR_SCREENINGS, REGIMES, REGIME_LABELS, TIERS, type Market, type MarketRegime } from '../../constants/schemas/device-file';
import type { FilingDetail } from '../../constants/schemas/filings';
import { palette, radii, space } from '../../constants/theme';
import { Checkbox } from '../ui/checkbox';
import { ChoiceChips } from '../ui/choice-chips';
import { Text } from '../ui/text';
import { StepFrame } from './step-frame';
import { arrayOf, isObject, useStepForm } from './use-step-form';

export interface MarketsValues {
  markets: Market[];
}

const TIER_CHOICES = [
  { value: 'general', label: 'General population' },
  { value: 'occupational', label: 'Occupational' },
] as const satisfies readonly { value: (typeof TIERS)[number]; label: string }[];

const FCC_CHOICES = [
  { value: 'exemption', label: '§1.1307(b)(3) exemption (default)' },
  { value: 'kdb-test-exclusion', label: 'KDB 447498 SAR test exclusion' },
] as const satisfies readonly { value: (typeof FCC_SAR_SCREENINGS)[number]; label: string }[];

const fromDraft = (raw: unknown, saved: MarketsValues): MarketsValues => (isObject(raw) ? { markets: arrayOf(raw.markets) as unknown as Market[] } : saved);

export function MarketsStep({ filing }: { filing: FilingDetail }) {
  const stepForm = useStepForm<MarketsValues>(filing, 'markets', fromDraft);
  const { form, editable } = stepForm;
  return (
    <StepFrame stepForm={stepForm} intro="The rule sets the filing is screened against. Each market gets its own column of results.">
      <Controller
        control={form.control}
        name="markets"
        render={({ field, fieldState }) => {
          const list: Market[] = field.value ?? [];
          const set = (regime: MarketRegime, next: Market | null) => {
            const others = list.filter((m) => m.regime !== regime);
            const merged = next ? [...others, next] : others;
            field.onChange(REGIMES.flatMap((r) => merged.filter((m) => m.regime === r)));
          };
          const errors = fieldState.error as unknown as ({ regime?: { message?: string }; tier?: { message?: string } } | undefined)[] | undefined;
          return (
            <View style={styles.list} testID="markets">
              {REGIMES.map((regime) => {
                const index = list.findIndex((m) => m.regime === regime);
                const m = index >= 0 ? list[index] : null;
                const error = index >= 0 ? (errors?.[index]?.regime?.message ?? errors?.[index]?.tier?.message) : undefined;
                return (
                  <View key={regime} style={[styles.market, m && styles.marketOn]}>
                    <Checkbox
                      label={REGIME_LABELS[regime]}
                      checked={!!m}
                      disabled={!editable}
                      onChange={(on) => set(regime, on ? { regime, tier: 'general', ...(regime === 'fcc' ? { fccSarScreening: 'exemption' } : {}) } : null)}
                      testID={`market-${regime}`}
                    />
                    {m ? (
                      <View style={styles.options}>
                        <ChoiceChips
                          label="Exposure tier"
                          choices={TIER_CHOICES}
                          value={m.tier}
                          disabled={!editable}
                          onChange={(tier) => set(regime, { ...m, tier })}
                          testID={`market-${regime}-tier`}
                        />
                        {regime === 'fcc' ? (
                          <ChoiceChips
                            label="SAR screening method"
                            choices={FCC_CHOICES}
                            value={m.fccSarScreening ?? 'exemption'}
                            disabled={!editable}
                            onChange={(fccSarScreening) => set(regime, { ...m, fccSarScreening })}
                            testID="market-fcc-method"
                          />
                        ) : null}
                      </View>
                    ) : null}
                    {error ? (
                      <Text variant="small" tone="fail">
                        {error}
                      </Text>
                    ) : null}
                  </View>
                );
              })}
              {fieldState.error?.message ? (
                <Text variant="small" tone="fail">
                  {fieldState.error.message}
                </Text>
              ) : null}
            </View>
          );
        }}
      />
    </StepFrame>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  market: { backgroundColor: palette.surface, borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, padding: space.sm, gap: space.sm },
  marketOn: { borderColor: palette.lineStrong },
  options: { gap: space.md, paddingLeft: space.xxl, paddingBottom: space.sm },
});
