import { Chart, Legend, LinearScale, LineController, LineElement, PointElement, Tooltip } from "chart.js";

// Only what a line chart on a number axis needs, so the rest of Chart.js stays out of the bundle.
Chart.register(LineController, LineElement, PointElement, LinearScale, Tooltip, Legend);

export { Chart };
