/** Apply the crew's theme (outdoor high-contrast by default, dark for dawn work) to the document. */
import { settings } from './settings.ts';

export function applyTheme(): void {
  const set = () => {
    const dark = settings.get().theme === 'dark';
    document.body.classList.toggle('gm-dark', dark);
    document.querySelector('meta[name="theme-color"]')?.setAttribute('content', dark ? '#000000' : '#ffffff');
  };
  set();
  settings.subscribe(set);
}
