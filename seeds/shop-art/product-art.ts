/**
 * Demo product pictures, drawn here in SVG and rasterised with sharp when the demo data is loaded. Every shape,
 * patch and mark is Padside's own invention for the invented team; nothing is traced from a photo or a real brand.
 */

/** One picture of a product: what to draw and the words a screen reader says for it. */
export interface ArtPiece {
  svg: string;
  alt: string;
}

const SIZE = 1200;
const frame = (body: string, bg = '#f1ede4') =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="${SIZE}" height="${SIZE}" viewBox="0 0 ${SIZE} ${SIZE}"><rect width="${SIZE}" height="${SIZE}" fill="${bg}"/>${body}</svg>`;

/** The season patch: a roundel with a rocket climbing over the prairie horizon, the team's initials and the season. */
function patch(cx: number, cy: number, r: number, season: number, accent: string): string {
  const s = r / 100;
  return `<g transform="translate(${cx} ${cy}) scale(${s})">
    <circle r="100" fill="#10263a" stroke="${accent}" stroke-width="9"/>
    <circle r="84" fill="none" stroke="#f6e7c8" stroke-width="2" stroke-dasharray="4 6"/>
    <path d="M-78 30 Q-40 18 0 26 T78 22 L78 40 Q0 60 -78 40 Z" fill="#3d6b3a"/>
    <path d="M-60 26 L-60 6 M-52 26 L-52 12" stroke="#c9a14a" stroke-width="3"/>
    <g transform="rotate(-28)">
      <path d="M0 -70 C10 -56 12 -40 12 -18 L12 20 L-12 20 L-12 -18 C-12 -40 -10 -56 0 -70 Z" fill="#f6e7c8"/>
      <path d="M-12 8 L-24 26 L-12 22 Z M12 8 L24 26 L12 22 Z" fill="${accent}"/>
      <circle cy="-24" r="5" fill="#10263a"/>
      <path d="M-7 22 Q0 48 7 22 Z" fill="#ff8a3d"/>
    </g>
    <text y="-4" x="-46" text-anchor="middle" font-family="DejaVu Sans, sans-serif" font-weight="700" font-size="20" fill="#f6e7c8" letter-spacing="2">T&amp;F</text>
    <text y="78" text-anchor="middle" font-family="DejaVu Sans, sans-serif" font-weight="700" font-size="17" fill="#f6e7c8" letter-spacing="3">SEASON ${season}</text>
  </g>`;
}

/** A plain tee seen flat from the front, with the patch on the chest. */
function shirt(colour: string, season: number, accent: string): string {
  const tee = `<path d="M420 210 Q600 290 780 210 L1010 330 L930 520 L850 480 L850 1030 Q600 1060 350 1030 L350 480 L270 520 L190 330 Z" fill="${colour}" stroke="rgba(0,0,0,0.18)" stroke-width="6"/>
    <path d="M420 210 Q600 330 780 210" fill="none" stroke="rgba(0,0,0,0.25)" stroke-width="14"/>
    <path d="M350 480 L350 1030 M850 480 L850 1030" stroke="rgba(0,0,0,0.08)" stroke-width="10"/>`;
  return frame(
    `<ellipse cx="600" cy="1085" rx="380" ry="38" fill="rgba(0,0,0,0.08)"/>${tee}${patch(600, 560, 150, season, accent)}`,
  );
}

/** The Season 3 shirt: the tee, and the patch up close. */
export function season3Shirt(): ArtPiece[] {
  return [
    {
      svg: shirt('#1f3f5b', 3, '#ff8a3d'),
      alt: 'Navy tee with the round Season 3 patch on the chest: a cream rocket climbing over a green prairie horizon.',
    },
    {
      svg: frame(patch(600, 600, 430, 3, '#ff8a3d'), '#e6dfd0'),
      alt: 'The Season 3 patch up close: T&F above, SEASON 3 below, an orange ring around a rocket over the prairie.',
    },
  ];
}

/** The Season 2 shirt (its run has shipped). */
export function season2Shirt(): ArtPiece[] {
  return [
    {
      svg: shirt('#6b2f2a', 2, '#c9a14a'),
      alt: 'Brick-red tee with the round Season 2 patch on the chest in gold and cream.',
    },
  ];
}

/** The nose-cone enamel pin, in gold and in silver. */
export function noseConePin(): ArtPiece[] {
  const pin = (metal: string, shine: string, cx: number, label: string) => `<g transform="translate(${cx} 600)">
      <path d="M0 -330 C120 -190 150 -60 150 120 L150 250 L-150 250 L-150 120 C-150 -60 -120 -190 0 -330 Z" fill="${metal}" stroke="${shine}" stroke-width="14"/>
      <path d="M0 -290 C95 -170 118 -60 118 110 L118 220 L-118 220 L-118 110 C-118 -60 -95 -170 0 -290 Z" fill="#10263a"/>
      <path d="M-118 40 L118 40 L118 80 L-118 80 Z" fill="#ff8a3d"/>
      <circle cy="-60" r="44" fill="#f6e7c8" stroke="${metal}" stroke-width="10"/>
      <path d="M-150 170 L-230 290 L-150 262 Z M150 170 L230 290 L150 262 Z" fill="${metal}" stroke="${shine}" stroke-width="10"/>
      <text y="190" text-anchor="middle" font-family="DejaVu Sans, sans-serif" font-weight="700" font-size="44" fill="${shine}" letter-spacing="4">${label}</text>
    </g>`;
  return [
    {
      svg: frame(pin('#c9a14a', '#f3d98b', 600, 'T&amp;F'), '#e9e3d6'),
      alt: 'Gold enamel pin shaped like a nose cone and fins: navy enamel, an orange band and a cream porthole.',
    },
    { svg: frame(pin('#a9b2bb', '#e4e9ee', 600, 'T&amp;F'), '#e9e3d6'), alt: 'The same nose-cone pin in silver.' },
  ];
}

/** The launch-rail sticker sheet: six die-cut stickers on a backing card. */
export function stickerSheet(): ArtPiece[] {
  const stickers = [
    patch(0, 0, 120, 3, '#ff8a3d'),
    // A fin can: three swept fins around a tube.
    `<rect x="-40" y="-120" width="80" height="200" rx="10" fill="#f6e7c8" stroke="#10263a" stroke-width="8"/><path d="M-40 20 L-120 110 L-40 80 Z M40 20 L120 110 L40 80 Z" fill="#ff8a3d" stroke="#10263a" stroke-width="8"/><path d="M-12 30 L12 30 L12 120 L-12 120 Z" fill="#3d6b3a" stroke="#10263a" stroke-width="6"/>`,
    // A filament spool with the loop of its loose end.
    `<circle r="115" fill="#3d6b3a" stroke="#10263a" stroke-width="8"/><circle r="78" fill="none" stroke="#9bd17f" stroke-width="22"/><circle r="30" fill="#f1ede4" stroke="#10263a" stroke-width="8"/><path d="M80 -60 C160 -120 170 40 100 20" fill="none" stroke="#9bd17f" stroke-width="10"/>`,
    // A launch rail against the sky.
    `<rect x="-120" y="-120" width="240" height="240" rx="30" fill="#9fc4e0" stroke="#10263a" stroke-width="8"/><path d="M-70 100 L40 -90" stroke="#10263a" stroke-width="16"/><path d="M-90 100 L60 100" stroke="#10263a" stroke-width="12"/><path d="M30 -100 L48 -60 L18 -72 Z" fill="#ff8a3d"/>`,
    // A parachute over a tiny rocket.
    `<path d="M-120 -10 Q0 -170 120 -10 Z" fill="#ff8a3d" stroke="#10263a" stroke-width="8"/><path d="M-120 -10 L-8 90 M120 -10 L8 90 M0 -10 L0 90" stroke="#10263a" stroke-width="5"/><rect x="-14" y="86" width="28" height="60" rx="8" fill="#f6e7c8" stroke="#10263a" stroke-width="6"/>`,
    // The team's initials in a badge.
    `<rect x="-130" y="-80" width="260" height="160" rx="80" fill="#10263a" stroke="#ff8a3d" stroke-width="10"/><text y="24" text-anchor="middle" font-family="DejaVu Sans, sans-serif" font-weight="700" font-size="72" fill="#f6e7c8">T&amp;F</text>`,
  ];
  const cells = stickers
    .map(
      (s, i) =>
        `<g transform="translate(${330 + (i % 2) * 540} ${270 + Math.floor(i / 2) * 330})"><g filter="url(#cut)">${s}</g></g>`,
    )
    .join('');
  const defs = `<defs><filter id="cut" x="-30%" y="-30%" width="160%" height="160%"><feMorphology in="SourceAlpha" operator="dilate" radius="12" result="grown"/><feFlood flood-color="#ffffff"/><feComposite in2="grown" operator="in" result="edge"/><feMerge><feMergeNode in="edge"/><feMergeNode in="SourceGraphic"/></feMerge></filter></defs>`;
  return [
    {
      svg: frame(
        `${defs}<rect x="90" y="60" width="1020" height="1080" rx="28" fill="#d9d2c3" stroke="#bdb4a2" stroke-width="4"/>${cells}`,
        '#efe9dd',
      ),
      alt: 'Sticker sheet with six die-cut stickers: the Season 3 patch, a fin can, a filament spool, a launch rail, a parachute and a T&F badge.',
    },
  ];
}
