/**
 * First-run panel: the cautions, shown until the crew acknowledges them once on this phone, and the crew member's
 * name, which signs every revision written from this phone (it can be left empty and set later in Settings).
 */
import { IonModal } from '@ionic/react';
import { useStore } from '../state/store.ts';
import { settings } from '../state/settings.ts';
import { TextField } from './fields.tsx';
import { SafetyNotice } from './SafetyNotice.tsx';

export function FirstRunSafety() {
  const s = useStore(settings);
  const open = s.safetyAcknowledgedAtMs === null;
  return (
    <IonModal isOpen={open} backdropDismiss={false} aria-labelledby="first-run-title">
      <div className="ion-padding" style={{ overflowY: 'auto' }}>
        <h1 id="first-run-title" style={{ fontSize: 22 }}>Before you start</h1>
        <p>
          Glintmark helps aim and log corner reflectors. The work itself is physical: reflectors are heavy, sharp-edged metal
          structures, set up outdoors, often near roads, in wind, on land that belongs to someone.
        </p>
        <SafetyNotice hazards={['lifting', 'edges', 'pinch', 'wind', 'lightning', 'digging', 'traffic', 'access']} title="Cautions for every site" />
        <TextField
          label="Your name (signs every record and change you make on this phone)"
          value={s.crewName}
          onChange={(v) => settings.set({ crewName: v })}
          testId="first-run-crew-name"
          hint="You can change it later in Settings. Left empty, changes are signed “crew (name not set)”."
        />
        <button type="button" className="gm-btn gm-primary" data-testid="ack-safety" onClick={() => settings.set({ safetyAcknowledgedAtMs: Date.now() })}>
          I have read these cautions
        </button>
      </div>
    </IonModal>
  );
}
