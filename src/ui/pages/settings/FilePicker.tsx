/** A labelled native file input; hands the chosen file on and clears itself so the same file can be picked again. */
import { useId, type ChangeEvent } from 'react';

export function FilePicker(props: { label: string; accept: string; testId: string; disabled?: boolean; onFile: (file: File) => void }) {
  const id = useId();
  const onChange = (e: ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (file) props.onFile(file);
  };
  return (
    <div className="gm-settings-file">
      <label htmlFor={id}>{props.label}</label>
      <input id={id} type="file" accept={props.accept} data-testid={props.testId} disabled={props.disabled} onChange={onChange} />
    </div>
  );
}
