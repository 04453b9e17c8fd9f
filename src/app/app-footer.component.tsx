import { EngineerCaution } from '../components/ui/engineer-caution.ui';

export function AppFooter() {
  return (
    <footer className="border-t border-line bg-paper">
      <div className="mx-auto flex max-w-6xl flex-col gap-1 px-6 py-4 sm:flex-row sm:items-center sm:justify-between">
        <EngineerCaution className="max-w-3xl" footer />
        <span className="label-caps shrink-0">Baywright</span>
      </div>
    </footer>
  );
}
