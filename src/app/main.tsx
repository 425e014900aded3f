import 'maplibre-gl/dist/maplibre-gl.css';
import './styles.css';
import { createRoot } from 'react-dom/client';
import { Root } from './Root';
import { bootPlanner } from './bootPlanner';
import { siteAnalysisRunnerStart } from './siteAnalysisRunner';

const root = document.getElementById('root');
if (root) {
  bootPlanner().then(() => {
    siteAnalysisRunnerStart();
    createRoot(root).render(<Root />);
  });
}

if (import.meta.env.PROD && 'serviceWorker' in navigator) {
  // Cache the built files after the first visit so the planner opens with no network.
  window.addEventListener('load', () => {
    navigator.serviceWorker.register('/sw.js').catch(() => undefined);
  });
}
