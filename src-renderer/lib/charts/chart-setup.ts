// Only the chart.js pieces the build sheet draws, registered once: the rest is tree-shaken.
import { BarController, BarElement, CategoryScale, Chart, Filler, Legend, LinearScale, LineController, LineElement, PointElement, ScatterController, Tooltip } from 'chart.js';

Chart.register(Filler, LineController, LineElement, PointElement, LinearScale, ScatterController, BarController, BarElement, CategoryScale, Legend, Tooltip);

Chart.defaults.font.family = "system-ui, -apple-system, 'Segoe UI', Roboto, sans-serif";
Chart.defaults.font.size = 11;
Chart.defaults.color = '#4a5563';
Chart.defaults.animation = false;

export { Chart };
