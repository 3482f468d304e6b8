import Svg, { Circle, Path, Rect } from 'react-native-svg';
import type { NavKey } from '@/constants/navigation';

/** Line icons for the navigation, drawn for Sightfan on a 24-unit grid with a 2-unit stroke. */
export function NavIcon({ name, color, size = 24 }: { name: NavKey; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 2, fill: 'none', strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" aria-hidden>
      {name === 'projects' ? (
        <>
          {/* A site plan with a corner mirror's fan. */}
          <Rect x={3} y={3} width={18} height={18} rx={2} {...stroke} />
          <Path d="M3 9 H9 V3" {...stroke} />
          <Path d="M9 9 L19 13 M9 9 L13 19" {...stroke} />
        </>
      ) : null}
      {name === 'quick' ? (
        <>
          {/* A stopwatch whose hand is a mirror's fan: the answer in a moment. */}
          <Circle cx={12} cy={13} r={8} {...stroke} />
          <Path d="M10 3 H14 M12 13 L16 9 M12 13 L16.5 14.5" {...stroke} />
        </>
      ) : null}
      {name === 'reviews' ? (
        <>
          <Path d="M12 3 L20 6 V12 C20 16.5 16.5 19.8 12 21 C7.5 19.8 4 16.5 4 12 V6 Z" {...stroke} />
          <Path d="M8.5 12 L11 14.5 L15.5 9.5" {...stroke} />
        </>
      ) : null}
      {name === 'users' ? (
        <>
          <Circle cx={9} cy={8} r={3.5} {...stroke} />
          <Path d="M2.5 20 C3 16 5.5 14 9 14 C12.5 14 15 16 15.5 20" {...stroke} />
          <Path d="M15.5 4.8 A3.5 3.5 0 0 1 15.5 11.2 M18 14.5 C20 15.3 21.2 17.2 21.5 20" {...stroke} />
        </>
      ) : null}
      {name === 'outbox' ? (
        <>
          <Rect x={3} y={5} width={18} height={14} rx={2} {...stroke} />
          <Path d="M3.5 6 L12 13 L20.5 6" {...stroke} />
        </>
      ) : null}
      {name === 'catalogue' ? (
        <>
          {/* A convex mirror on its bracket, beside catalogue lines. */}
          <Circle cx={8} cy={10} r={5} {...stroke} />
          <Path d="M8 15 V21 M5 21 H11" {...stroke} />
          <Path d="M15 6 H21 M15 10 H21 M15 14 H19" {...stroke} />
        </>
      ) : null}
      {name === 'account' ? (
        <>
          <Circle cx={12} cy={8} r={4} {...stroke} />
          <Path d="M4 21 C4.5 16.5 7.5 14 12 14 C16.5 14 19.5 16.5 20 21" {...stroke} />
        </>
      ) : null}
    </Svg>
  );
}
