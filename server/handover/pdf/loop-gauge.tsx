/** @jsxRuntime automatic */
import { Line, Polygon, Rect, Svg, Text, View } from '@react-pdf/renderer';
import type { SnapshotBand } from '../snapshot';
import { BAND_NAMES, ohmsText } from './format';
import { colours } from './styles';

/**
 * The loop gauge: a horizontal resistance scale with the zone's designed bands (short,
 * normal, alarm, open) and the measured secure reading marked. Logarithmic from 1 Ω to 1 MΩ,
 * the same for every zone so gauges can be compared down the schedule. The gaps between
 * bands are where a reading is out of tolerance. Each band carries its name as well as its
 * colour, so the gauge reads in black and white.
 */
const LOW_DECADE = 0; // 1 Ω
const HIGH_DECADE = 6; // 1 MΩ
const TRACK_TOP = 9;
const TRACK_HEIGHT = 8;
const LABEL_SIZE = 6;
const LABEL_ROW = 8;
const MIN_BAND_WIDTH = 3;

const BAND_COLOURS: Record<SnapshotBand['state'], string> = {
  short_circuit: colours.fault,
  normal: colours.normal,
  alarm: colours.alarm,
  open_circuit: colours.fault,
};

/** Where a resistance sits across a gauge `width` points wide. */
export function gaugeX(ohms: number, width: number): number {
  if (!(ohms > 0)) return 0;
  const decade = Math.min(HIGH_DECADE, Math.max(LOW_DECADE, Math.log10(ohms)));
  return ((decade - LOW_DECADE) / (HIGH_DECADE - LOW_DECADE)) * width;
}

/** A rough text width for Plex Sans, enough to keep labels from overprinting each other. */
const labelWidth = (text: string, size: number) => text.length * size * 0.56 + 2;

interface PlacedLabel {
  text: string;
  centre: number;
  row: number;
}

/** Labels go on the first row where they do not collide with the one before them. */
function placeLabels(labels: { text: string; centre: number }[], width: number): PlacedLabel[] {
  const rowEnds: number[] = [];
  return [...labels]
    .sort((a, b) => a.centre - b.centre)
    .map((label) => {
      const half = labelWidth(label.text, LABEL_SIZE) / 2;
      const centre = Math.min(width - half, Math.max(half, label.centre));
      let row = rowEnds.findIndex((end) => end + 2 <= centre - half);
      if (row === -1) row = rowEnds.length;
      rowEnds[row] = centre + half;
      return { text: label.text, centre, row };
    });
}

export function LoopGauge(props: {
  bands: SnapshotBand[];
  /** The measured secure reading; null for "OL" (open); undefined when not measured. */
  measuredOhms: number | null | undefined;
  width: number;
}) {
  const { width } = props;
  const drawn = props.bands.map((band) => {
    let x1 = gaugeX(band.lowOhms, width);
    let x2 = band.highOhms === null ? width : gaugeX(band.highOhms, width);
    if (x2 - x1 < MIN_BAND_WIDTH) {
      const middle = (x1 + x2) / 2;
      x1 = Math.max(0, middle - MIN_BAND_WIDTH / 2);
      x2 = Math.min(width, x1 + MIN_BAND_WIDTH);
    }
    return { band, x1, x2 };
  });
  const labels = placeLabels(
    drawn.map(({ band, x1, x2 }) => ({ text: BAND_NAMES[band.state], centre: (x1 + x2) / 2 })),
    width,
  );
  const rows = Math.max(1, ...labels.map((label) => label.row + 1));
  const height = TRACK_TOP + TRACK_HEIGHT + 2 + rows * LABEL_ROW;

  const measured = props.measuredOhms;
  const markerX =
    measured === undefined ? null : measured === null ? width - 1 : gaugeX(measured, width);
  const markerText =
    measured === undefined
      ? null
      : measured === null
        ? 'measured: OL'
        : `measured ${ohmsText(measured)}`;
  const markerWidth = markerText ? labelWidth(markerText, LABEL_SIZE) + 4 : 0;

  const ticks = Array.from({ length: HIGH_DECADE - LOW_DECADE + 1 }, (_, index) =>
    gaugeX(10 ** (LOW_DECADE + index), width),
  );

  return (
    <View style={{ width, height, position: 'relative' }}>
      <Svg width={width} height={height} style={{ position: 'absolute', top: 0, left: 0 }}>
        <Rect x={0} y={TRACK_TOP} width={width} height={TRACK_HEIGHT} fill={colours.track} />
        {drawn.map(({ band, x1, x2 }) => (
          <Rect
            key={band.state}
            x={x1}
            y={TRACK_TOP}
            width={x2 - x1}
            height={TRACK_HEIGHT}
            fill={BAND_COLOURS[band.state]}
          />
        ))}
        {ticks.map((x) => (
          <Line
            key={x}
            x1={x}
            x2={x}
            y1={TRACK_TOP + TRACK_HEIGHT}
            y2={TRACK_TOP + TRACK_HEIGHT + 2}
            stroke={colours.muted}
            strokeWidth={0.5}
          />
        ))}
        {markerX !== null ? (
          <>
            <Line
              x1={markerX}
              x2={markerX}
              y1={TRACK_TOP - 2}
              y2={TRACK_TOP + TRACK_HEIGHT + 2}
              stroke={colours.ink}
              strokeWidth={1.4}
            />
            <Polygon
              points={`${markerX - 3},${TRACK_TOP - 5} ${markerX + 3},${TRACK_TOP - 5} ${markerX},${TRACK_TOP - 1}`}
              fill={colours.ink}
            />
          </>
        ) : null}
      </Svg>
      {markerX !== null && markerText !== null ? (
        <Text
          style={{
            position: 'absolute',
            top: 0,
            // Beside the marker's arrowhead, on whichever side has room.
            left: markerX + 5 + markerWidth <= width ? markerX + 5 : markerX - 5 - markerWidth,
            width: markerWidth,
            textAlign: markerX + 5 + markerWidth <= width ? 'left' : 'right',
            fontSize: LABEL_SIZE,
            lineHeight: 1.2,
            fontWeight: 600,
          }}
        >
          {markerText}
        </Text>
      ) : null}
      {labels.map((label) => {
        const half = labelWidth(label.text, LABEL_SIZE) / 2;
        return (
          <Text
            key={label.text}
            style={{
              position: 'absolute',
              top: TRACK_TOP + TRACK_HEIGHT + 2 + label.row * LABEL_ROW,
              left: label.centre - half - 4,
              width: half * 2 + 8,
              textAlign: 'center',
              fontSize: LABEL_SIZE,
              lineHeight: 1.2,
              color: colours.ink,
            }}
          >
            {label.text}
          </Text>
        );
      })}
    </View>
  );
}
