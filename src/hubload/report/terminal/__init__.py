"""Terminal output (rich): one module per command, and the renderer of table specs."""
