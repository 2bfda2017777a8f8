import { Link } from 'react-router';
import { ADVISORY_CAUTION_SHORT } from '../../config/product';

export function FooterCaution() {
  return (
    <footer className="col-span-2 border-t border-rule bg-panel px-4 py-1.5 text-xs text-ink/80">
      <Link to="/about" className="hover:underline">
        {ADVISORY_CAUTION_SHORT} <span className="font-medium underline">About Shadowloop</span>
      </Link>
    </footer>
  );
}
