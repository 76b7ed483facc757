PYTHON ?= python3
VENV   := .venv
BIN    := $(VENV)/bin
# Each target installs only what it needs: the core (demo, bench) or the core
# with the test tools and the optional extras the tests exercise (test).
CORE   := $(VENV)/.installed-core
STAMP  := $(VENV)/.installed

.PHONY: demo test bench mutate clean

$(BIN)/python:
	$(PYTHON) -m venv $(VENV)

$(CORE): $(BIN)/python pyproject.toml
	@echo "covertree: installing covertree with networkx, sympy, click and rich into $(VENV) (first run only; pip takes about a minute)"
	$(BIN)/python -m pip install --quiet --upgrade pip
	$(BIN)/python -m pip install --quiet -e .
	touch $(CORE)

$(STAMP): $(CORE)
	@echo "covertree: adding the test tools (pytest, hypothesis) and the extras under test (matplotlib, dask) to $(VENV) (first run only; about a minute)"
	$(BIN)/python -m pip install --quiet -e '.[test,draw,dask]'
	touch $(STAMP)

demo: $(CORE)
	$(BIN)/covertree count --genus 3 --target-genus 1 --degree 2
	$(BIN)/covertree catalogue --genus 3 --target-genus 1 --degree 2 --codim 1

test: $(STAMP)
	$(BIN)/python -m pytest -q

# Mutation testing, one layer at a time (each run takes minutes, niced):
#   make mutate LAYER=stabilisation      (score against the work tree's tests)
#   make mutate LAYER=graphs BASE=main   (score against the tests of main)
#   make mutate LAYER=graphs AGAIN=1     (rerun the scratch copy: new code and tests, survivors again)
# LAYER is one of symmetric, hurwitz, graphs, monodromy, gluing, stabilisation,
# catalogue, tallies, intersection; scratch copies go to build/mutate/.
MUTATE := $(VENV)/.installed-mutate

$(MUTATE): $(STAMP)
	$(BIN)/python -m pip install --quiet -e '.[test,draw,dask,mutate]'
	touch $(MUTATE)

mutate: $(MUTATE)
	@test -n "$(LAYER)" || { echo "make mutate LAYER=name (see tools/mutate.py)" >&2; exit 2; }
	$(BIN)/python tools/mutate.py $(LAYER) $(if $(BASE),--tests-from $(BASE)) $(if $(AGAIN),--again)

bench: $(CORE)
	$(BIN)/python benchmarks/run.py

clean:
	rm -rf $(VENV) build *.egg-info .pytest_cache
