/** The aim to align to: from the Plan screen, or typed here when there is none. Compact, so the live values stay in view. */
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { requireInRange } from '../../../core/validate.ts';
import { NumberField, parseField } from '../../components/fields.tsx';
import { fmtNum } from '../../format.ts';
import { workflow } from '../../state/workflow.ts';
import type { AlignTarget } from './computeAlign.ts';

export function TargetCard(props: { target: AlignTarget | null }) {
  const [editing, setEditing] = useState(false);
  const [az, setAz] = useState('');
  const [tilt, setTilt] = useState('');
  const [roll, setRoll] = useState('0');
  const t = props.target;
  const pAz = parseField('Azimuth', az, (n, v) => requireInRange(n, v, { min: 0, max: 360, maxInclusive: false, unit: '°' }));
  const pTilt = parseField('Tilt', tilt, (n, v) => requireInRange(n, v, { min: -60, max: 60, unit: '°' }));
  const pRoll = parseField('Roll', roll, (n, v) => requireInRange(n, v, { min: -60, max: 60, unit: '°' }));
  const valid = pAz.value !== undefined && pTilt.value !== undefined && pRoll.value !== undefined;
  const typed = az !== '' || tilt !== '';

  const use = () => {
    if (!valid) return;
    workflow.set({ target: { azimuthDeg: pAz.value!, tiltDeg: pTilt.value!, rollDeg: pRoll.value! } });
    setEditing(false);
  };

  return (
    <section aria-label="Target">
      {t ? (
        <p className="gm-align-target" data-testid="target">
          <span className="gm-label">Target</span> azimuth <b data-testid="target-azimuth">{fmtNum(t.azimuthDeg, 1)}°</b> true · tilt{' '}
          <b data-testid="target-tilt">{fmtNum(t.tiltDeg, 1)}°</b> · roll <b data-testid="target-roll">{fmtNum(t.rollDeg, 1)}°</b>{' '}
          {!editing ? (
            <button type="button" className="gm-btn" onClick={() => setEditing(true)} data-testid="edit-target">
              Change
            </button>
          ) : null}
        </p>
      ) : (
        <p className="gm-warn" data-testid="plan-first">
          No aim yet. <Link to="/plan">Plan an aim first</Link>, or type the target below.
        </p>
      )}
      {!t || editing ? (
        <div className="gm-card">
          <div className="gm-row">
            <NumberField label="Target azimuth" unit="° true" value={az} onChange={setAz} error={typed ? pAz.error : undefined} testId="target-azimuth-input" />
            <NumberField label="Target tilt" unit="°" value={tilt} onChange={setTilt} error={typed ? pTilt.error : undefined} testId="target-tilt-input" />
            <NumberField label="Target roll" unit="°" value={roll} onChange={setRoll} error={typed ? pRoll.error : undefined} testId="target-roll-input" />
          </div>
          <div className="gm-btnrow">
            <button type="button" className="gm-btn gm-primary" disabled={!valid} onClick={use} data-testid="use-target">
              Use this target
            </button>
            {t ? (
              <button type="button" className="gm-btn" onClick={() => setEditing(false)}>
                Cancel
              </button>
            ) : null}
          </div>
        </div>
      ) : null}
    </section>
  );
}
