import Svg, { Circle, Defs, Line, LinearGradient, Path, Stop } from 'react-native-svg';
import { palette } from '@/constants/theme';

/**
 * A corner mirror's view over a floor plan, as the sign-in screen's picture: the dome at top left,
 * its widened fan across the aisle, and a person inside the fan who can now be seen.
 */
export function FanIllustration({ width = 360 }: { width?: number }) {
  const height = width * 0.75;
  return (
    <Svg width={width} height={height} viewBox="0 0 400 300" aria-hidden>
      <Defs>
        <LinearGradient id="fan" x1="0" y1="0" x2="1" y2="1">
          <Stop offset="0" stopColor={palette.beacon} stopOpacity={0.95} />
          <Stop offset="1" stopColor={palette.beacon} stopOpacity={0.25} />
        </LinearGradient>
      </Defs>
      {/* Walls and racking of a plan, in plan-drawing lines. */}
      <Path d="M20 20 H380 V280 H20 Z" stroke={palette.onAsphaltMuted} strokeWidth={2} fill="none" />
      {/* The fan: what a convex mirror at the corner shows. */}
      <Path d="M40 40 L380 110 A330 330 0 0 1 240 280 Z" fill="url(#fan)" />
      {[0.2, 0.4, 0.6, 0.8].map((t) => (
        <Line
          key={t}
          x1={40}
          y1={40}
          x2={380 - 140 * t}
          y2={110 + 170 * t}
          stroke={palette.asphalt}
          strokeOpacity={0.25}
          strokeWidth={1.5}
        />
      ))}
      {/* Racking drawn over the fan: the mirror cannot see through it. */}
      <Path d="M170 125 H380 M170 205 H380" stroke={palette.onAsphaltMuted} strokeWidth={12} />
      {/* The mirror, a dome seen from above. */}
      <Circle cx={40} cy={40} r={16} fill={palette.glass} stroke={palette.onAsphalt} strokeWidth={3} />
      {/* A person stepping out of the aisle: hidden from the cross-aisle, visible in the mirror. */}
      <Circle cx={150} cy={158} r={9} fill={palette.onAsphalt} />
      <Path d="M150 169 V189" stroke={palette.onAsphalt} strokeWidth={5} strokeLinecap="round" />
    </Svg>
  );
}
