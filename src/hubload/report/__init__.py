"""Output: terminal tables (rich), JSON, files and plots. Computes nothing."""
