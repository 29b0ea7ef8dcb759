// Front-end entry (placeholder until the page is built).
