/**
 * SAR against depth (react-native-svg + d3-scale/d3-shape), each tissue layer shaded, its boundary
 * marked and its name written in it. Two scales: absolute (W/kg on a log axis, where the model
 * allows it) and relative (SAR over the surface SAR on a linear axis, inside the reactive near
 * field). Always captioned as a model estimate, never a measured SAR.
 */
import { scaleLinear, scaleLog } from 'd3-scale';
import { line } from 'd3-shape';
import { useState } from 'react';
import { View } from 'react-native';
import Svg, { G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '../../constants/theme';
import { Text } from '../ui/text';

export interface DepthPoint {
  depthM: number;
  /** W/kg on the absolute scale; SAR ÷ surface SAR on the relative one. */
  value: number;
}
export type DepthScale = 'absolute' | 'relative';
export interface DepthLayer {
  name: string;
  thicknessM: number | null;
}

const HEIGHT = 280;
const M = { top: 34, right: 16, bottom: 44, left: 64 };
const LAYER_FILLS = [palette.accentSoft, palette.paper, palette.paperDeep, palette.surface];

export const DEPTH_AXIS_LABEL: Record<DepthScale, string> = {
  absolute: 'Local SAR (W/kg, log scale)',
  relative: 'Relative SAR (surface = 1)',
};
export const DEPTH_CAPTION: Record<DepthScale, string> = {
  absolute: 'Model estimate: a plane wave on flat tissue layers. It explains the margin; it is not a measured SAR.',
  relative: 'Shape only, surface = 1: inside the reactive near field the model gives no W/kg. It explains the margin; it is not a measured SAR.',
};

const sarTick = (v: number) => (v >= 0.01 && v < 1000 ? String(Number(v.toPrecision(2))) : v.toExponential(0).replace('e+', 'e'));

/** `depthLimitMm` shows only the first millimetres (the thin outer layers); the default is all of the profile. */
export function DepthProfileChart({ points, scale, layers, depthLimitMm, testID }: { points: DepthPoint[]; scale: DepthScale; layers: DepthLayer[]; depthLimitMm?: number; testID?: string }) {
  const [width, setWidth] = useState(0);
  const profileDepthMm = Math.max(...points.map((p) => p.depthM * 1000), 1);
  const maxDepthMm = depthLimitMm ? Math.min(depthLimitMm, profileDepthMm) : profileDepthMm;
  const data = points.filter((p) => p.value > 0 && Number.isFinite(p.value) && p.depthM * 1000 <= maxDepthMm + 1e-9);
  const values = data.map((p) => p.value);
  const yMax = Math.max(...values, 1e-12);
  const yMin = Math.max(Math.min(...values, yMax), yMax / 1e6);
  const x = scaleLinear()
    .domain([0, maxDepthMm])
    .range([M.left, Math.max(width - M.right, M.left + 1)]);
  // Relative: linear from 0 so the shape reads directly (1 = the surface); absolute: log, SAR falls by decades.
  const y =
    scale === 'relative'
      ? scaleLinear()
          .domain([0, Math.max(1, yMax)])
          .range([HEIGHT - M.bottom, M.top])
          .nice()
      : scaleLog()
          .domain([yMin, yMax])
          .range([HEIGHT - M.bottom, M.top])
          .nice();
  const path = line<DepthPoint>()
    .x((p) => x(p.depthM * 1000))
    .y((p) => y(scale === 'relative' ? p.value : Math.max(p.value, yMin)))(data);

  // Layer bands from the stack's thicknesses; the last (semi-infinite) one runs to the edge.
  const bands: { name: string; fromMm: number; toMm: number }[] = [];
  let at = 0;
  for (const l of layers) {
    const to = l.thicknessM === null ? maxDepthMm : Math.min(at + l.thicknessM * 1000, maxDepthMm);
    bands.push({ name: l.name, fromMm: at, toMm: to });
    at = to;
  }
  const decades = scale === 'absolute' ? y.ticks().filter((t) => Math.abs(Math.log10(t) - Math.round(Math.log10(t))) < 1e-9) : [];
  const yTicks = decades.length >= 2 ? decades : y.ticks(scale === 'relative' ? 5 : 4);
  const xTicks = x.ticks(6);

  return (
    <View testID={testID}>
      <View
        onLayout={(e) => setWidth(e.nativeEvent.layout.width)}
        style={{ width: '100%', height: HEIGHT }}
        testID={testID ? `${testID}-plot` : undefined}
        role="img"
        accessibilityLabel={`${DEPTH_AXIS_LABEL[scale]} against depth, model estimate, layers ${layers.map((l) => l.name).join(', ')}`}
      >
        {width > 0 ? (
          <Svg width={width} height={HEIGHT}>
            {bands.map((b, i) => (
              <G key={b.name}>
                <Rect x={x(b.fromMm)} y={M.top} width={Math.max(x(b.toMm) - x(b.fromMm), 0)} height={HEIGHT - M.top - M.bottom} fill={LAYER_FILLS[i % LAYER_FILLS.length]} />
                {i > 0 ? <Line x1={x(b.fromMm)} x2={x(b.fromMm)} y1={M.top - 4} y2={HEIGHT - M.bottom} stroke={palette.inkMuted} strokeDasharray="4 3" strokeWidth={1} /> : null}
                <SvgText x={(x(b.fromMm) + x(b.toMm)) / 2} y={M.top - 10} fontSize={11} fontFamily={fonts.medium} fill={palette.inkSoft} textAnchor="middle">
                  {x(b.toMm) - x(b.fromMm) > 34 ? b.name : b.name.slice(0, 1)}
                </SvgText>
              </G>
            ))}
            {yTicks.map((t) => (
              <G key={`y${t}`}>
                <Line x1={M.left} x2={width - M.right} y1={y(t)} y2={y(t)} stroke={palette.line} strokeWidth={1} />
                <SvgText x={M.left - 6} y={y(t) + 4} fontSize={11} fontFamily={fonts.mono} fill={palette.inkMuted} textAnchor="end">
                  {scale === 'relative' ? String(Number(t.toPrecision(2))) : sarTick(t)}
                </SvgText>
              </G>
            ))}
            {xTicks.map((t) => (
              <SvgText key={`x${t}`} x={x(t)} y={HEIGHT - M.bottom + 16} fontSize={11} fontFamily={fonts.mono} fill={palette.inkMuted} textAnchor="middle">
                {String(t)}
              </SvgText>
            ))}
            <Line x1={M.left} x2={width - M.right} y1={HEIGHT - M.bottom} y2={HEIGHT - M.bottom} stroke={palette.inkMuted} />
            <Line x1={M.left} x2={M.left} y1={M.top} y2={HEIGHT - M.bottom} stroke={palette.inkMuted} />
            {path ? <Path d={path} stroke={palette.accent} strokeWidth={2.2} fill="none" /> : null}
            <SvgText x={(M.left + width - M.right) / 2} y={HEIGHT - 8} fontSize={12} fontFamily={fonts.regular} fill={palette.inkSoft} textAnchor="middle">
              Depth below the skin surface (mm)
            </SvgText>
            <SvgText
              x={14}
              y={(M.top + HEIGHT - M.bottom) / 2}
              fontSize={12}
              fontFamily={fonts.regular}
              fill={palette.inkSoft}
              textAnchor="middle"
              rotation={-90}
              origin={`14, ${(M.top + HEIGHT - M.bottom) / 2}`}
            >
              {DEPTH_AXIS_LABEL[scale]}
            </SvgText>
          </Svg>
        ) : null}
      </View>
      <Text variant="small" tone="soft" testID={testID ? `${testID}-caption` : undefined}>
        {DEPTH_CAPTION[scale]}
      </Text>
    </View>
  );
}
