/** Clean-up steps run once, last added first (what was started last is stopped first). */
export function cleanupStack() {
  const steps: (() => Promise<void> | void)[] = [];
  let running: Promise<void> | undefined;
  return {
    push(step: () => Promise<void> | void) {
      steps.push(step);
    },
    run(): Promise<void> {
      running ??= (async () => {
        for (const step of steps.reverse()) {
          try {
            await step();
          } catch (err) {
            console.error("Error while stopping:", err);
          }
        }
      })();
      return running;
    },
  };
}
