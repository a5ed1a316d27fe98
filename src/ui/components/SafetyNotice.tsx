/** Cautions shown where the work is hazardous. Glintmark defers to local codes and licensed practice. */
export type Hazard = 'lifting' | 'pinch' | 'wind' | 'lightning' | 'digging' | 'traffic' | 'access' | 'edges';

const TEXT: Record<Hazard, string> = {
  lifting: 'Lift and carry reflectors with two people; a large reflector and its base are heavy and awkward.',
  pinch: 'Keep fingers clear of hinges, clamps and the plate edge when tilting the base plate.',
  edges: 'Panel edges and corners are sharp: wear gloves and eye protection when handling.',
  wind: 'A reflector catches wind like a sail: do not work on it in strong or gusty wind; secure it before leaving.',
  lightning: 'Stop work and leave the reflector if thunder is heard or lightning is forecast: it is a tall metal object.',
  digging: 'Before digging or drilling for a foundation, check for buried services (cables, pipes) with the utilities.',
  traffic: 'Near roads, wear high-visibility clothing and set out warning signs as local rules require.',
  access: 'Have the landowner\'s permission and any permits before entering land or installing a structure.',
};

export function SafetyNotice(props: { hazards: readonly Hazard[]; title?: string }) {
  return (
    <section className="gm-caution" aria-label="Safety cautions">
      <h2>{props.title ?? 'Cautions'}</h2>
      <ul>
        {props.hazards.map((h) => (
          <li key={h}>{TEXT[h]}</li>
        ))}
      </ul>
      <p className="gm-note">These are reminders, not a safety plan: follow local codes, site rules and licensed practice.</p>
    </section>
  );
}
