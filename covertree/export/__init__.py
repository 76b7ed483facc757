"""Rendering of covertree results as JSON, CSV and LaTeX (pure functions,
no terminal output)."""
