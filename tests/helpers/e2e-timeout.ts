jest.setTimeout(Number(process.env.E2E_TIMEOUT_MS ?? 120000));
