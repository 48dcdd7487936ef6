export const linkClass =
  "font-medium text-rill-700 underline decoration-rill-300 underline-offset-2 hover:text-rill-800 hover:decoration-rill-600";
