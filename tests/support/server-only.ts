// 'server-only' throws outside a React Server bundle; vitest runs server code directly.
export {};
