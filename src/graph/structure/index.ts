// Re-exports of this folder's modules (append one line per module).
