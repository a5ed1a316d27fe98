/** Tab icons as inline SVG data URLs of our own (no icon font to download, works offline). */
const svg = (body: string) =>
  `data:image/svg+xml;utf8,<svg xmlns='http://www.w3.org/2000/svg' viewBox='0 0 24 24' fill='none' stroke='currentColor' stroke-width='2.2' stroke-linecap='round' stroke-linejoin='round'>${body}</svg>`;

export const TABS = [
  { tab: 'plan', path: '/plan', label: 'Plan', icon: svg('<path d="M4 20 L4 8 L12 4 L20 8 L20 20 Z"/><path d="M4 20 L12 12 L20 20"/>') },
  { tab: 'passes', path: '/passes', label: 'Passes', icon: svg('<circle cx="12" cy="12" r="9"/><path d="M5 17 Q12 2 19 7"/><circle cx="19" cy="7" r="1.8"/>') },
  { tab: 'align', path: '/align', label: 'Align', icon: svg('<circle cx="12" cy="12" r="8"/><path d="M12 2 L12 7 M12 17 L12 22 M2 12 L7 12 M17 12 L22 12"/>') },
  { tab: 'logbook', path: '/logbook', label: 'Logbook', icon: svg('<path d="M6 3 H18 V21 H6 Z"/><path d="M9 8 H15 M9 12 H15 M9 16 H13"/>') },
] as const;
