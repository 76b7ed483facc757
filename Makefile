PYTHON ?= python3
VENV   := .venv
BIN    := $(VENV)/bin
STAMP  := $(VENV)/.installed

.PHONY: demo test bench clean

$(BIN)/python:
	$(PYTHON) -m venv $(VENV)

$(STAMP): $(BIN)/python pyproject.toml
	$(BIN)/python -m pip install --quiet --upgrade pip
	$(BIN)/python -m pip install --quiet -e '.[test,draw,dask]'
	touch $(STAMP)

demo: $(STAMP)
	$(BIN)/covertree count --genus 3 --target-genus 1 --degree 2
	$(BIN)/covertree catalogue --genus 3 --target-genus 1 --degree 2 --codim 1

test: $(STAMP)
	$(BIN)/python -m pytest -q

bench: $(STAMP)
	$(BIN)/python benchmarks/run.py

clean:
	rm -rf $(VENV) build *.egg-info .pytest_cache
