const SVG_STYLE = { display: 'block', flexShrink: 0 } as const;

export type IconName = 'today' | 'recipes' | 'kitchen' | 'plan' | 'more' | 'desk';

/**
 * Hand-drawn line icons (our own), 24-unit grid, drawn in the given colour. Plain SVG elements (the app ships on the
 * web only): react-native-svg would add about 47 KB to the JavaScript every first screen loads.
 */
export function Icon({ name, color, size = 24 }: { name: IconName; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 1.8, fill: 'none', strokeLinecap: 'round', strokeLinejoin: 'round' } as const;
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden="true" focusable="false" style={SVG_STYLE}>
      {name === 'today' ? (
        <>
          <path d="M5.5 16a6.5 6.5 0 0 1 13 0M2.5 16h19M7 19.5h10" {...stroke} />
          <path d="M12 4v2.5M4.9 7.4l1.8 1.8M19.1 7.4l-1.8 1.8" {...stroke} />
        </>
      ) : null}
      {name === 'recipes' ? (
        <>
          <path d="M5 4.5h10.5a3 3 0 0 1 3 3v12H8a3 3 0 0 1-3-3z" {...stroke} />
          <path d="M5 16.5a3 3 0 0 1 3-3h10.5M9 8h6" {...stroke} />
        </>
      ) : null}
      {name === 'kitchen' ? (
        <>
          <path d="M4 10h16v5.5a4.5 4.5 0 0 1-4.5 4.5h-7A4.5 4.5 0 0 1 4 15.5z" {...stroke} />
          <path d="M2 11.5h2M20 11.5h2M9 6.5c0-1.5 1.2-1.5 1.2-3M13.5 6.5c0-1.5 1.2-1.5 1.2-3" {...stroke} />
        </>
      ) : null}
      {name === 'plan' ? (
        <>
          <rect x={3.5} y={5} width={17} height={15} rx={2.5} {...stroke} />
          <path d="M3.5 9.5h17M8 3v4M16 3v4M7.5 13h2M11 13h2M14.5 13h2M7.5 16.5h2M11 16.5h2" {...stroke} />
        </>
      ) : null}
      {name === 'desk' ? (
        <>
          <rect x={5} y={4.5} width={14} height={16} rx={2} {...stroke} />
          <path d="M9 3.5h6v2.5H9zM8.5 10.5h7M8.5 14h7M8.5 17.5h4" {...stroke} />
        </>
      ) : null}
      {name === 'more' ? (
        <>
          <circle cx={12} cy={8} r={3.5} {...stroke} />
          <path d="M5 20c.8-3.6 3.6-5.5 7-5.5s6.2 1.9 7 5.5" {...stroke} />
        </>
      ) : null}
    </svg>
  );
}
